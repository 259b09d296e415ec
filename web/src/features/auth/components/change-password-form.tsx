import { Alert, Button, Field, Input, Stack } from '@chakra-ui/react';
import { zodResolver } from '@hookform/resolvers/zod';
import { changePasswordSchema, NEW_PASSWORD_MIN } from '@sixtyfold/shared';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { FailureAlert } from '@/components/ui/failure-alert';
import { applyFieldErrors, isFieldRefusal } from '@/lib/form-errors';
import { useChangePassword } from '../api/change-password';

/** The API's schema, plus a second entry of the new password: a typo there would lock me out. */
const changePasswordFormSchema = changePasswordSchema
  .safeExtend({ repeatPassword: z.string() })
  .refine((values) => values.repeatPassword === values.newPassword, { path: ['repeatPassword'], message: 'The two new passwords differ' });
type ChangePasswordValues = z.infer<typeof changePasswordFormSchema>;

const EMPTY: ChangePasswordValues = { currentPassword: '', newPassword: '', repeatPassword: '' };

/** Changes my password with the schema the API checks; my other sessions end, this one stays. */
export function ChangePasswordForm() {
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors, isDirty },
  } = useForm<ChangePasswordValues>({ resolver: zodResolver(changePasswordFormSchema), defaultValues: EMPTY });
  const change = useChangePassword();

  const onSubmit = handleSubmit(({ repeatPassword: _, ...body }) =>
    change.mutate(body, { onSuccess: () => reset(EMPTY), onError: (error) => applyFieldErrors(error, setError) }),
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Change password">
      <Stack gap="4" maxW="md">
        {change.isSuccess && !isDirty && (
          <Alert.Root status="success" variant="subtle" borderRadius="md" role="status">
            <Alert.Indicator />
            <Alert.Content>
              <Alert.Title>Password changed</Alert.Title>
              <Alert.Description>You stay signed in here; every other session of yours has ended.</Alert.Description>
            </Alert.Content>
          </Alert.Root>
        )}
        {change.isError && !isFieldRefusal(change.error) && <FailureAlert title="Could not change your password">{change.error.message}</FailureAlert>}
        <Field.Root invalid={!!errors.currentPassword}>
          <Field.Label>Current password</Field.Label>
          <Input type="password" autoComplete="current-password" bg="bg.panel" {...register('currentPassword')} />
          <Field.ErrorText>{errors.currentPassword?.message}</Field.ErrorText>
        </Field.Root>
        <Field.Root invalid={!!errors.newPassword}>
          <Field.Label>New password</Field.Label>
          <Input type="password" autoComplete="new-password" bg="bg.panel" {...register('newPassword')} />
          <Field.HelperText>At least {NEW_PASSWORD_MIN} characters.</Field.HelperText>
          <Field.ErrorText>{errors.newPassword?.message}</Field.ErrorText>
        </Field.Root>
        <Field.Root invalid={!!errors.repeatPassword}>
          <Field.Label>New password again</Field.Label>
          <Input type="password" autoComplete="new-password" bg="bg.panel" {...register('repeatPassword')} />
          <Field.ErrorText>{errors.repeatPassword?.message}</Field.ErrorText>
        </Field.Root>
        <Button type="submit" colorPalette="ember" alignSelf="start" loading={change.isPending} loadingText="Changing…">
          Change password
        </Button>
      </Stack>
    </form>
  );
}
