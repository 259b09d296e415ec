import { Alert, Button, Field, Input, Stack } from '@chakra-ui/react';
import { zodResolver } from '@hookform/resolvers/zod';
import { newAccountSchema, NEW_PASSWORD_MIN, type CurrentUser, type NewAccount } from '@sixtyfold/shared';
import { useForm } from 'react-hook-form';
import { ApiRequestError } from '@/lib/api-client';
import { showApiFieldErrors } from '@/lib/api-field-errors';
import { useAcceptInvitation } from '../api/accept-invitation';

/** Accepting as a new address: the person picks their name and password, and is signed in. */
export function NewAccountForm({ token, email, onJoined }: { token: string; email: string; onJoined: (user: CurrentUser) => void }) {
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<NewAccount>({ resolver: zodResolver(newAccountSchema), defaultValues: { displayName: '', password: '' } });
  const accept = useAcceptInvitation(token, { onSuccess: onJoined });

  const onSubmit = handleSubmit((values) =>
    accept.mutate(values, {
      onError: (error) => showApiFieldErrors(error, ['displayName', 'password'], setError),
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Create your account">
      <Stack gap="4">
        {accept.isError && !(accept.error instanceof ApiRequestError && accept.error.status === 400) && (
          <Alert.Root status="error" variant="subtle" borderRadius="md" role="alert">
            <Alert.Indicator />
            <Alert.Content>
              <Alert.Title>Could not accept the invitation</Alert.Title>
              <Alert.Description>{accept.error.message}</Alert.Description>
            </Alert.Content>
          </Alert.Root>
        )}
        <Field.Root>
          <Field.Label>E-mail address</Field.Label>
          <Input value={email} readOnly bg="bg.subtle" autoComplete="username" />
        </Field.Root>
        <Field.Root invalid={!!errors.displayName}>
          <Field.Label>Your name</Field.Label>
          <Input bg="bg.panel" autoComplete="name" {...register('displayName')} />
          <Field.HelperText>As your group will see it.</Field.HelperText>
          <Field.ErrorText>{errors.displayName?.message}</Field.ErrorText>
        </Field.Root>
        <Field.Root invalid={!!errors.password}>
          <Field.Label>Password</Field.Label>
          <Input type="password" bg="bg.panel" autoComplete="new-password" {...register('password')} />
          <Field.HelperText>At least {NEW_PASSWORD_MIN} characters.</Field.HelperText>
          <Field.ErrorText>{errors.password?.message}</Field.ErrorText>
        </Field.Root>
        <Button type="submit" colorPalette="ember" loading={accept.isPending} loadingText="Joining…">
          Create account and join
        </Button>
      </Stack>
    </form>
  );
}
