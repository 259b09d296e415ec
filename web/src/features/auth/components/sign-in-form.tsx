import { Button, Field, Input, Stack } from '@chakra-ui/react';
import { zodResolver } from '@hookform/resolvers/zod';
import { loginSchema, type CurrentUser, type Login } from '@sixtyfold/shared';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { FailureAlert } from '@/components/ui/failure-alert';
import { ApiRequestError } from '@/lib/api-client';
import { applyFieldErrors } from '@/lib/form-errors';
import { useLogin } from '../api/login';

type LoginInput = z.input<typeof loginSchema>;

function describeError(error: Error): { title: string; description: string } {
  if (!(error instanceof ApiRequestError)) {
    return { title: 'Sign-in failed', description: 'Something unexpected went wrong. Reload the page and try again.' };
  }
  switch (error.status) {
    case 0:
      return { title: 'Could not reach the Sixtyfold server', description: 'Check your connection, then try again.' };
    case 401:
      return { title: error.message, description: 'Check both fields; passwords are case-sensitive.' };
    case 403:
      // The password was right, but the account is disabled.
      return { title: error.message, description: 'Ask a site administrator if you need your account back.' };
    case 429:
      // The API says which limit was reached and in how many seconds to try again.
      return { title: 'Too many attempts, wait a minute', description: error.message };
    case 400:
      return { title: 'Check the highlighted fields', description: error.message };
    default:
      return {
        title: error.message,
        description: 'Try again in a moment. If it keeps failing, tell your site administrator.',
      };
  }
}

export function SignInForm({ onSuccess }: { onSuccess: (user: CurrentUser) => void }) {
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<LoginInput, unknown, Login>({
    resolver: zodResolver(loginSchema),
    defaultValues: { email: '', password: '' },
  });
  const login = useLogin({ onSuccess });

  const onSubmit = handleSubmit((values) =>
    login.mutate(values, {
      onError: (error) => applyFieldErrors(error, setError),
    }),
  );

  const failure = login.error ? describeError(login.error) : null;

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Sign in">
      <Stack gap="5">
        {failure && (
          <FailureAlert title={failure.title}>{failure.description}</FailureAlert>
        )}
        <Field.Root invalid={!!errors.email}>
          <Field.Label>E-mail</Field.Label>
          <Input type="email" autoComplete="username" size="lg" bg="bg.panel" {...register('email')} />
          <Field.ErrorText>{errors.email?.message}</Field.ErrorText>
        </Field.Root>
        <Field.Root invalid={!!errors.password}>
          <Field.Label>Password</Field.Label>
          <Input type="password" autoComplete="current-password" size="lg" bg="bg.panel" {...register('password')} />
          <Field.ErrorText>{errors.password?.message}</Field.ErrorText>
        </Field.Root>
        <Button type="submit" colorPalette="ember" size="lg" loading={login.isPending} loadingText="Signing in…">
          Sign in
        </Button>
      </Stack>
    </form>
  );
}
