import { Alert, Button, Field, Input, Stack, Textarea } from '@chakra-ui/react';
import { zodResolver } from '@hookform/resolvers/zod';
import { updateGroupSchema, type GroupDetail, type UpdateGroup } from '@sixtyfold/shared';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { ApiRequestError } from '@/lib/api-client';
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
      onError: (error) => {
        if (!(error instanceof ApiRequestError)) return;
        for (const field of ['name', 'description', 'pointLimit'] as const) {
          const message = error.fieldErrors[field]?.[0];
          if (message) setError(field, { message });
        }
      },
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
        <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ base: 'stretch', md: 'start' }}>
          <Field.Root invalid={!!errors.name} flex="2">
            <Field.Label>Name</Field.Label>
            <Input bg="bg.panel" autoComplete="off" {...register('name')} />
            <Field.ErrorText>{errors.name?.message}</Field.ErrorText>
          </Field.Root>
          <Field.Root invalid={!!errors.pointLimit} flex="1">
            <Field.Label>Point limit</Field.Label>
            <Input type="number" bg="bg.panel" {...register('pointLimit', { valueAsNumber: true })} />
            <Field.HelperText>Largest scan the group may submit, in points.</Field.HelperText>
            <Field.ErrorText>{errors.pointLimit?.message}</Field.ErrorText>
          </Field.Root>
        </Stack>
        <Field.Root invalid={!!errors.description}>
          <Field.Label>Description</Field.Label>
          <Textarea rows={2} bg="bg.panel" {...register('description')} />
          <Field.ErrorText>{errors.description?.message}</Field.ErrorText>
        </Field.Root>
        <Button type="submit" variant="outline" alignSelf="start" loading={update.isPending} loadingText="Saving…">
          Save group
        </Button>
      </Stack>
    </form>
  );
}
