import { chakra, Field, Stack } from '@chakra-ui/react';
import { PRUNABLE_STATUSES } from '@sixtyfold/shared';
import type { UseFormRegisterReturn } from 'react-hook-form';

interface PrunableStatusesFieldProps {
  /** `register('statuses')` of the form. */
  registration: UseFormRegisterReturn;
  error?: string;
  disabled?: boolean;
  flex?: string;
}

/** One checkbox per status a prune or a retention policy may select. */
export function PrunableStatusesField({ registration, error, disabled, flex }: PrunableStatusesFieldProps) {
  return (
    <Field.Root invalid={!!error} disabled={disabled} flex={flex}>
      <Field.Label as="span">Statuses</Field.Label>
      <Stack direction="row" gap="3" wrap="wrap" role="group" aria-label="Statuses">
        {PRUNABLE_STATUSES.map((status) => (
          <chakra.label key={status} display="inline-flex" alignItems="center" gap="1.5" fontSize="sm">
            <input type="checkbox" value={status} disabled={disabled} {...registration} />
            {status}
          </chakra.label>
        ))}
      </Stack>
      <Field.HelperText>Queued and running scans are never pruned.</Field.HelperText>
      <Field.ErrorText>{error}</Field.ErrorText>
    </Field.Root>
  );
}
