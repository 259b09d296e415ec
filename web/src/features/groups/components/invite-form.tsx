import { Alert, Button, Field, Input, NativeSelect, Stack } from '@chakra-ui/react';
import { zodResolver } from '@hookform/resolvers/zod';
import { createInvitationSchema, GROUP_ROLE_DESCRIPTIONS, GROUP_ROLES, type CreateInvitation, type Invitation } from '@sixtyfold/shared';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { ApiRequestError } from '@/lib/api-client';
import { showApiFieldErrors } from '@/lib/api-field-errors';
import { useCreateInvitation } from '../api/create-invitation';

type CreateInvitationInput = z.input<typeof createInvitationSchema>;

export function InviteForm({ groupId, onInvited }: { groupId: number; onInvited?: (invitation: Invitation) => void }) {
  const {
    register,
    handleSubmit,
    reset,
    setError,
    watch,
    formState: { errors },
  } = useForm<CreateInvitationInput, unknown, CreateInvitation>({
    resolver: zodResolver(createInvitationSchema),
    defaultValues: { email: '', role: 'member' },
  });
  const invite = useCreateInvitation(groupId, {
    onSuccess: (invitation) => {
      reset({ email: '', role: invitation.role });
      onInvited?.(invitation);
    },
  });
  const role = watch('role');

  const onSubmit = handleSubmit((values) =>
    invite.mutate(values, {
      onError: (error) => showApiFieldErrors(error, ['email', 'role'], setError),
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Invite someone">
      <Stack gap="4">
        {invite.isError && !(invite.error instanceof ApiRequestError && invite.error.status === 400) && (
          <Alert.Root status="error" variant="subtle" borderRadius="md" role="alert">
            <Alert.Indicator />
            <Alert.Content>
              <Alert.Title>Could not send the invitation</Alert.Title>
              <Alert.Description>{invite.error.message}</Alert.Description>
            </Alert.Content>
          </Alert.Root>
        )}
        {invite.isSuccess && (
          <Alert.Root status="success" variant="subtle" borderRadius="md">
            <Alert.Indicator />
            <Alert.Title fontWeight="400">Invitation sent to {invite.data.email}.</Alert.Title>
          </Alert.Root>
        )}
        <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ base: 'stretch', md: 'start' }}>
          <Field.Root invalid={!!errors.email} flex="2">
            <Field.Label>E-mail address</Field.Label>
            <Input type="email" placeholder="name@institute.example" bg="bg.panel" autoComplete="off" {...register('email')} />
            <Field.ErrorText>{errors.email?.message}</Field.ErrorText>
          </Field.Root>
          <Field.Root invalid={!!errors.role} flex="1">
            <Field.Label>Role</Field.Label>
            <NativeSelect.Root>
              <NativeSelect.Field bg="bg.panel" {...register('role')}>
                {GROUP_ROLES.map((option) => (
                  <option key={option} value={option}>
                    {option}
                  </option>
                ))}
              </NativeSelect.Field>
              <NativeSelect.Indicator />
            </NativeSelect.Root>
            <Field.HelperText>A {role} may {GROUP_ROLE_DESCRIPTIONS[role]}.</Field.HelperText>
            <Field.ErrorText>{errors.role?.message}</Field.ErrorText>
          </Field.Root>
        </Stack>
        <Button type="submit" colorPalette="ember" alignSelf="start" loading={invite.isPending} loadingText="Sending…">
          Send invitation
        </Button>
      </Stack>
    </form>
  );
}
