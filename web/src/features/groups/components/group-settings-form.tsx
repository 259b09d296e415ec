import { Button, Stack } from '@chakra-ui/react';
import { zodResolver } from '@hookform/resolvers/zod';
import { updateGroupSchema, type GroupDetail, type UpdateGroup } from '@sixtyfold/shared';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { SaveStatus } from '@/components/ui/save-status';
import { applyFieldErrors } from '@/lib/form-errors';
import { GroupFields } from './group-fields';
import { useUpdateGroup } from '../api/update-group';

type UpdateGroupInput = z.input<typeof updateGroupSchema>;

/** Site admins edit a group's name, description and point limit. */
export function GroupSettingsForm({ group }: { group: GroupDetail }) {
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<UpdateGroupInput, unknown, UpdateGroup>({
    resolver: zodResolver(updateGroupSchema),
    defaultValues: { name: group.name, description: group.description, pointLimit: group.pointLimit },
  });
  const update = useUpdateGroup(group.id);

  const onSubmit = handleSubmit((values) =>
    update.mutate(values, { onError: (error) => applyFieldErrors(error, setError) }),
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Group settings">
      <Stack gap="4">
        <SaveStatus mutation={update} errorTitle="Could not save the group" />
        <GroupFields register={register} errors={errors} />
        <Button type="submit" variant="outline" alignSelf="start" loading={update.isPending} loadingText="Saving…">
          Save group
        </Button>
      </Stack>
    </form>
  );
}
