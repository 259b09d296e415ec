import { Alert, Button, Stack } from '@chakra-ui/react';
import { zodResolver } from '@hookform/resolvers/zod';
import { updateGroupSchema, type GroupDetail, type UpdateGroup } from '@sixtyfold/shared';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { ApiRequestError } from '@/lib/api-client';
import { showApiFieldErrors } from '@/lib/api-field-errors';
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
    update.mutate(values, {
      onError: (error) => showApiFieldErrors(error, ['name', 'description', 'pointLimit'], setError),
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Group settings">
      <Stack gap="4">
        {update.isError && !(update.error instanceof ApiRequestError && update.error.status === 400) && (
          <Alert.Root status="error" variant="subtle" borderRadius="md" role="alert">
            <Alert.Indicator />
            <Alert.Content>
              <Alert.Title>Could not save the group</Alert.Title>
              <Alert.Description>{update.error.message}</Alert.Description>
            </Alert.Content>
          </Alert.Root>
        )}
        {update.isSuccess && (
          <Alert.Root status="success" variant="subtle" borderRadius="md">
            <Alert.Indicator />
            <Alert.Title fontWeight="400">Saved.</Alert.Title>
          </Alert.Root>
        )}
        <GroupFields register={register} errors={errors} />
        <Button type="submit" variant="outline" alignSelf="start" loading={update.isPending} loadingText="Saving…">
          Save group
        </Button>
      </Stack>
    </form>
  );
}
