import { Button, Field, Input, Stack, Switch } from '@chakra-ui/react';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  API_TOKEN_DEFAULT_DAYS, API_TOKEN_MAX_DAYS, createApiTokenSchema, type CreateApiToken, type CreateApiTokenInput, type CreatedApiToken,
} from '@sixtyfold/shared';
import { Controller, useForm } from 'react-hook-form';
import { FailureAlert } from '@/components/ui/failure-alert';
import { applyFieldErrors, isFieldRefusal } from '@/lib/form-errors';
import { useCreateToken } from '../api/create-token';

export function CreateTokenForm({ onCreated }: { onCreated: (token: CreatedApiToken) => void }) {
  const {
    register,
    control,
    handleSubmit,
    reset,
    setError,
    formState: { errors },
  } = useForm<CreateApiTokenInput, unknown, CreateApiToken>({
    resolver: zodResolver(createApiTokenSchema),
    defaultValues: { name: '', expiresInDays: API_TOKEN_DEFAULT_DAYS, readOnly: false },
  });
  const create = useCreateToken({
    onSuccess: (token) => {
      reset();
      onCreated(token);
    },
  });

  const onSubmit = handleSubmit((values) =>
    create.mutate(values, { onError: (error) => applyFieldErrors(error, setError) }),
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Create an API token">
      <Stack gap="4">
        {create.isError && !isFieldRefusal(create.error) && <FailureAlert title="Could not create the token">{create.error.message}</FailureAlert>}
        <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ base: 'stretch', md: 'start' }}>
          <Field.Root invalid={!!errors.name} flex="2">
            <Field.Label>Name</Field.Label>
            <Input placeholder="e.g. laptop notebook" bg="bg.panel" autoComplete="off" {...register('name')} />
            <Field.HelperText>What the token is for, so you know which one to revoke.</Field.HelperText>
            <Field.ErrorText>{errors.name?.message}</Field.ErrorText>
          </Field.Root>
          <Field.Root invalid={!!errors.expiresInDays} flex="1">
            <Field.Label>Expires after (days)</Field.Label>
            <Input
              type="number"
              inputMode="numeric"
              min={1}
              max={API_TOKEN_MAX_DAYS}
              bg="bg.panel"
              {...register('expiresInDays', { valueAsNumber: true })}
            />
            <Field.HelperText>From 1 to {API_TOKEN_MAX_DAYS}; every token expires.</Field.HelperText>
            <Field.ErrorText>{errors.expiresInDays?.message}</Field.ErrorText>
          </Field.Root>
        </Stack>
        <Field.Root invalid={!!errors.readOnly}>
          <Controller
            control={control}
            name="readOnly"
            render={({ field }) => (
              <Switch.Root
                name={field.name}
                checked={field.value === true}
                onCheckedChange={(details) => field.onChange(details.checked)}
                colorPalette="ember"
              >
                <Switch.HiddenInput onBlur={field.onBlur} />
                <Switch.Control />
                <Switch.Label>Read-only</Switch.Label>
              </Switch.Root>
            )}
          />
          <Field.HelperText>A read-only token can fetch scans and results but cannot submit, change or delete anything.</Field.HelperText>
          <Field.ErrorText>{errors.readOnly?.message}</Field.ErrorText>
        </Field.Root>
        <Button type="submit" colorPalette="ember" alignSelf="start" loading={create.isPending} loadingText="Creating…">
          Create token
        </Button>
      </Stack>
    </form>
  );
}
