import { Alert, Button, Fieldset, RadioGroup, Stack, Text } from '@chakra-ui/react';
import { zodResolver } from '@hookform/resolvers/zod';
import { userPreferencesSchema, type NotificationEmailMode, type UserPreferences } from '@sixtyfold/shared';
import { Controller, useForm } from 'react-hook-form';
import { FailureAlert } from '@/components/ui/failure-alert';
import { applyFieldErrors, isFieldRefusal } from '@/lib/form-errors';
import { useUpdatePreferences } from '../api/update-preferences';

const EMAIL_CHOICES: { value: NotificationEmailMode; label: string; help: string }[] = [
  { value: 'immediate', label: 'At once', help: 'An e-mail for each notification, as it happens.' },
  { value: 'daily', label: 'Daily digest', help: 'One e-mail each morning with what came in the day before.' },
  { value: 'never', label: 'Never', help: 'No e-mail; notifications only show here in Sixtyfold.' },
];

/** How notifications reach me by e-mail, saved with the same schema the API checks. */
export function PreferencesForm({ preferences }: { preferences: UserPreferences }) {
  const {
    control,
    handleSubmit,
    reset,
    setError,
    formState: { errors, isDirty },
  } = useForm<UserPreferences>({ resolver: zodResolver(userPreferencesSchema), defaultValues: preferences });
  const save = useUpdatePreferences();

  const onSubmit = handleSubmit((values) =>
    save.mutate(values, {
      onSuccess: (saved) => reset(saved),
      onError: (error) => applyFieldErrors(error, setError),
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Notification preferences">
      <Stack gap="5">
        {save.isSuccess && !isDirty && (
          <Alert.Root status="success" variant="subtle" borderRadius="md" role="status">
            <Alert.Indicator />
            <Alert.Content>
              <Alert.Title>Saved</Alert.Title>
              <Alert.Description>Your e-mail preference is stored; the next notification follows it.</Alert.Description>
            </Alert.Content>
          </Alert.Root>
        )}
        {save.isError && !isFieldRefusal(save.error) && <FailureAlert title="Could not save your preferences">{save.error.message}</FailureAlert>}
        <Fieldset.Root invalid={!!errors.notificationEmail}>
          <Fieldset.Legend fontWeight="600" color="ink.900">
            E-mail me about notifications
          </Fieldset.Legend>
          <Controller
            control={control}
            name="notificationEmail"
            render={({ field }) => (
              <RadioGroup.Root
                name={field.name}
                value={field.value}
                onValueChange={(details) => field.onChange(details.value)}
                colorPalette="ember"
                mt="2"
              >
                <Stack gap="3">
                  {EMAIL_CHOICES.map((choice) => (
                    <RadioGroup.Item key={choice.value} value={choice.value} alignItems="start">
                      <RadioGroup.ItemHiddenInput onBlur={field.onBlur} />
                      <RadioGroup.ItemIndicator mt="0.5" />
                      <RadioGroup.ItemText>
                        <Text as="span" fontWeight="500" color="ink.900">
                          {choice.label}
                        </Text>
                        <Text as="span" display="block" fontSize="sm" color="fg.muted">
                          {choice.help}
                        </Text>
                      </RadioGroup.ItemText>
                    </RadioGroup.Item>
                  ))}
                </Stack>
              </RadioGroup.Root>
            )}
          />
          <Fieldset.ErrorText>{errors.notificationEmail?.message}</Fieldset.ErrorText>
        </Fieldset.Root>
        <Button type="submit" colorPalette="ember" alignSelf="start" loading={save.isPending} loadingText="Saving…">
          Save preferences
        </Button>
      </Stack>
    </form>
  );
}
