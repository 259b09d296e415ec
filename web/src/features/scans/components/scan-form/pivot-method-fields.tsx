import { Field, Fieldset, Input, NativeSelect, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import { toNumber, type ScanFormValues } from './scan-form-values';
import { MethodOptions } from '@/components/ui/method-options';

interface PivotMethodFieldsProps {
  register: UseFormRegister<ScanFormValues>;
  errors: FieldErrors<ScanFormValues>;
  pivotKind: ScanFormValues['pivot']['kind'];
  method: ScanFormValues['method'];
  /** How an input the scan varies is described ("on an axis.", "from the points file."), or null when it is fixed. */
  variedNote: (input: string) => string | null;
}

/** The pivot (fixed N_* or reheating, with the values no axis or column varies), the method and the tolerance. */
export function PivotMethodFields({ register, errors, pivotKind, method, variedNote }: PivotMethodFieldsProps) {
  return (
    <Fieldset.Root>
      <Fieldset.Legend fontSize="md" fontWeight="600" color="ink.900" mb="3">
        Pivot and method
      </Fieldset.Legend>
      <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
        <Field.Root>
          <Field.Label>Pivot</Field.Label>
          <NativeSelect.Root>
            <NativeSelect.Field bg="bg.panel" {...register('pivot.kind')}>
              <option value="fixed">Fixed N_*</option>
              <option value="reheating">N_* from reheating</option>
            </NativeSelect.Field>
            <NativeSelect.Indicator />
          </NativeSelect.Root>
          <Field.HelperText>
            {pivotKind === 'fixed'
              ? 'The pivot leaves the horizon N_* e-folds before the end of inflation.'
              : 'N_* follows from the reheating history: its equation of state and the energy where radiation takes over.'}
          </Field.HelperText>
        </Field.Root>
        {pivotKind === 'fixed' ? (
          <PivotValue label="N_*" onAxisNote={variedNote('nStar') && `N_* varies ${variedNote('nStar')}`} error={errors.pivot?.nStar?.message}>
            <Input type="number" step="any" bg="bg.panel" fontFamily="mono" {...register('pivot.nStar', { setValueAs: toNumber })} />
          </PivotValue>
        ) : (
          <>
            <PivotValue label="w_reh" onAxisNote={variedNote('reheatingW') && `w_reh varies ${variedNote('reheatingW')}`} error={errors.pivot?.w?.message}>
              <Input type="number" step="any" bg="bg.panel" fontFamily="mono" {...register('pivot.w', { setValueAs: toNumber })} />
            </PivotValue>
            <PivotValue
              label="ρ_reh^1/4 (GeV)"
              onAxisNote={variedNote('reheatingEnergyGeV') && `The reheating energy varies ${variedNote('reheatingEnergyGeV')}`}
              error={errors.pivot?.energyGeV?.message}
            >
              <Input type="number" step="any" bg="bg.panel" fontFamily="mono" {...register('pivot.energyGeV', { setValueAs: toNumber })} />
            </PivotValue>
          </>
        )}
        <Field.Root>
          <Field.Label>Method</Field.Label>
          <NativeSelect.Root>
            <NativeSelect.Field bg="bg.panel" {...register('method')}>
              <MethodOptions />
            </NativeSelect.Field>
            <NativeSelect.Indicator />
          </NativeSelect.Root>
          <Field.HelperText>
            {method === 'slowroll'
              ? 'Observables from the slow-roll parameters at the pivot: fast.'
              : 'Solves the mode equation for the spectra near the pivot: slower, exact.'}
          </Field.HelperText>
        </Field.Root>
        <Field.Root invalid={!!errors.tolerance}>
          <Field.Label>Tolerance</Field.Label>
          <Input type="number" step="any" bg="bg.panel" fontFamily="mono" placeholder="engine default" {...register('tolerance', { setValueAs: toNumber })} />
          <Field.HelperText>Optional relative tolerance of the integrator, between 1e-14 and 1e-4.</Field.HelperText>
          <Field.ErrorText>{errors.tolerance?.message}</Field.ErrorText>
        </Field.Root>
      </SimpleGrid>
    </Fieldset.Root>
  );
}

interface PivotValueProps {
  label: string;
  /** Set when an axis varies this value, which then has no fixed value. */
  onAxisNote: string | null;
  error: string | undefined;
  children: ReactNode;
}

function PivotValue({ label, onAxisNote, error, children }: PivotValueProps) {
  if (onAxisNote) {
    return (
      <Stack gap="1.5" justify="center">
        <Text fontSize="sm" fontWeight="500">
          {label}
        </Text>
        <Text fontSize="sm" color="fg.muted">
          {onAxisNote}
        </Text>
        {error && <Text fontSize="sm" color="fg.error">{error}</Text>}
      </Stack>
    );
  }
  return (
    <Field.Root invalid={!!error}>
      <Field.Label>{label}</Field.Label>
      {children}
      <Field.ErrorText>{error}</Field.ErrorText>
    </Field.Root>
  );
}
