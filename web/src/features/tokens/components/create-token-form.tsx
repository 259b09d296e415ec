import { Alert, Button, Field, Input, NativeSelect, Stack } from '@chakra-ui/react';
import { zodResolver } from '@hookform/resolvers/zod';
import { createApiTokenSchema, type CreateApiToken, type CreatedApiToken } from '@sixtyfold/shared';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { ApiRequestError } from '@/lib/api-client';
import { showApiFieldErrors } from '@/lib/api-field-errors';
import { useCreateToken } from '../api/create-token';

type CreateApiTokenInput = z.input<typeof createApiTokenSchema>;

// Lifetimes offered in the form; the API takes any whole number of days up to a year.
const LIFETIMES = [
  { days: 7, label: '7 days' },
  { days: 30, label: '30 days' },
  { days: 90, label: '90 days' },
  { days: 365, label: '1 year' },
] as const;
const NO_EXPIRY = '';

export function CreateTokenForm({ onCreated }: { onCreated: (token: CreatedApiToken) => void }) {
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors },
  } = useForm<CreateApiTokenInput, unknown, CreateApiToken>({
    resolver: zodResolver(createApiTokenSchema),
    defaultValues: { name: '', expiresInDays: 90 },
  });
  const create = useCreateToken({
    onSuccess: (token) => {
      reset();
      onCreated(token);
    },
  });

  const onSubmit = handleSubmit((values) =>
    create.mutate(values, {
      onError: (error) => showApiFieldErrors(error, ['name', 'expiresInDays'], setError),
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Create an API token">
      <Stack gap="4">
        {create.isError && !(create.error instanceof ApiRequestError && create.error.status === 400) && (
          <Alert.Root status="error" variant="subtle" borderRadius="md" role="alert">
            <Alert.Indicator />
            <Alert.Content>
              <Alert.Title>Could not create the token</Alert.Title>
              <Alert.Description>{create.error.message}</Alert.Description>
            </Alert.Content>
          </Alert.Root>
        )}
        <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ base: 'stretch', md: 'start' }}>
          <Field.Root invalid={!!errors.name} flex="2">
            <Field.Label>Name</Field.Label>
            <Input placeholder="e.g. laptop notebook" bg="bg.panel" autoComplete="off" {...register('name')} />
            <Field.HelperText>What the token is for, so you know which one to revoke.</Field.HelperText>
            <Field.ErrorText>{errors.name?.message}</Field.ErrorText>
          </Field.Root>
          <Field.Root invalid={!!errors.expiresInDays} flex="1">
            <Field.Label>Expires after</Field.Label>
            <NativeSelect.Root>
              <NativeSelect.Field
                bg="bg.panel"
                {...register('expiresInDays', { setValueAs: (value: string | number) => (value === NO_EXPIRY ? undefined : Number(value)) })}
              >
                {LIFETIMES.map((lifetime) => (
                  <option key={lifetime.days} value={lifetime.days}>
                    {lifetime.label}
                  </option>
                ))}
                <option value={NO_EXPIRY}>Never</option>
              </NativeSelect.Field>
              <NativeSelect.Indicator />
            </NativeSelect.Root>
            <Field.ErrorText>{errors.expiresInDays?.message}</Field.ErrorText>
          </Field.Root>
        </Stack>
        <Button type="submit" colorPalette="ember" alignSelf="start" loading={create.isPending} loadingText="Creating…">
          Create token
        </Button>
      </Stack>
    </form>
  );
}
