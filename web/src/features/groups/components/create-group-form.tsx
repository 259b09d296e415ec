import { Alert, Button, Stack } from '@chakra-ui/react';
import { zodResolver } from '@hookform/resolvers/zod';
import { createGroupSchema, type CreateGroup, type GroupDetail } from '@sixtyfold/shared';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { ApiRequestError } from '@/lib/api-client';
import { showApiFieldErrors } from '@/lib/api-field-errors';
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
    create.mutate(values, {
      onError: (error) => showApiFieldErrors(error, ['name', 'description', 'pointLimit'], setError),
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Create a group">
      <Stack gap="4">
        {create.isError && !(create.error instanceof ApiRequestError && create.error.status === 400) && (
          <Alert.Root status="error" variant="subtle" borderRadius="md" role="alert">
            <Alert.Indicator />
            <Alert.Content>
              <Alert.Title>Could not create the group</Alert.Title>
              <Alert.Description>{create.error.message}</Alert.Description>
            </Alert.Content>
          </Alert.Root>
        )}
        <GroupFields register={register} errors={errors} />
        <Button type="submit" colorPalette="ember" alignSelf="start" loading={create.isPending} loadingText="Creating…">
          Create group
        </Button>
      </Stack>
    </form>
  );
}
