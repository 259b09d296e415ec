import { Button, Stack } from '@chakra-ui/react';
import { zodResolver } from '@hookform/resolvers/zod';
import { createGroupSchema, type CreateGroup, type GroupDetail } from '@sixtyfold/shared';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { FailureAlert } from '@/components/ui/failure-alert';
import { applyFieldErrors, isFieldRefusal } from '@/lib/form-errors';
import { GroupFields } from './group-fields';
import { useCreateGroup } from '../api/create-group';

type CreateGroupInput = z.input<typeof createGroupSchema>;

export function CreateGroupForm({ onCreated }: { onCreated: (group: GroupDetail) => void }) {
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors },
  } = useForm<CreateGroupInput, unknown, CreateGroup>({
    resolver: zodResolver(createGroupSchema),
    defaultValues: { name: '', description: '', pointLimit: 1_000_000 },
  });
  const create = useCreateGroup({
    onSuccess: (group) => {
      reset();
      onCreated(group);
    },
  });

  const onSubmit = handleSubmit((values) =>
    create.mutate(values, { onError: (error) => applyFieldErrors(error, setError) }),
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Create a group">
      <Stack gap="4">
        {create.isError && !isFieldRefusal(create.error) && <FailureAlert title="Could not create the group">{create.error.message}</FailureAlert>}
        <GroupFields register={register} errors={errors} />
        <Button type="submit" colorPalette="ember" alignSelf="start" loading={create.isPending} loadingText="Creating…">
          Create group
        </Button>
      </Stack>
    </form>
  );
}
