import { Field, Fieldset, HStack, Input, NativeSelect, SimpleGrid, Stack, Text, Textarea, VisuallyHidden } from '@chakra-ui/react';
import type { ModelParameter } from '@sixtyfold/shared';
import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import { RemoveButton } from '@/components/ui/remove-button';
import { PIVOT_AXIS_INFO } from './scan-form-edits';
import { firstMessage, toNumber, type AxisDraft, type ScanFormValues } from './scan-form-values';

interface AxisFieldsProps {
  index: number;
  kind: AxisDraft['kind'];
  parameter: string;
  parameters: ModelParameter[];
  register: UseFormRegister<ScanFormValues>;
  errors: FieldErrors<AxisDraft> | undefined;
  onParameterChange: (parameter: string) => void;
  /** Absent for the only axis: a scan needs at least one. */
  onRemove?: () => void;
}

export function AxisFields({ index, kind, parameter, parameters, register, errors, onParameterChange, onRemove }: AxisFieldsProps) {
  const n = index + 1;
  const name = `axes.${index}` as const;
  const numberField = (field: 'min' | 'max' | 'count') => register(`${name}.${field}`, { setValueAs: toNumber });
  // Visible labels stay short; screen readers hear which axis each input belongs to.
  const label = (text: string) => (
    <>
      <VisuallyHidden>Axis {n} </VisuallyHidden>
      <Text as="span" textTransform="capitalize">
        {text}
      </Text>
    </>
  );

  return (
    <Fieldset.Root borderWidth="1px" borderColor="border" borderRadius="lg" p="4" bg="bg.panel">
      <HStack justify="space-between" align="center" mb="3">
        <Fieldset.Legend fontWeight="600" color="ink.900">
          Axis {n}
        </Fieldset.Legend>
        {onRemove && (
          <RemoveButton label={`Remove axis ${n}`} onClick={onRemove}>
            Remove
          </RemoveButton>
        )}
      </HStack>
      <Stack gap="4">
        <SimpleGrid columns={{ base: 1, sm: 2 }} gap="4">
          <Field.Root invalid={!!errors?.parameter}>
            <Field.Label>{label('parameter')}</Field.Label>
            <NativeSelect.Root>
              <NativeSelect.Field
                bg="bg.panel"
                {...register(`${name}.parameter`)}
                // Controlled, as its options follow the model; the form's handler also moves the
                // quantity out of the fixed values.
                value={parameter}
                onChange={(event) => onParameterChange(event.target.value)}
              >
                <option value="">Choose what this axis varies</option>
                <optgroup label="Model parameters">
                  {parameters.map((p) => (
                    <option key={p.name} value={p.name}>
                      {p.description ? `${p.name} (${p.description})` : p.name}
                    </option>
                  ))}
                </optgroup>
                <optgroup label="Pivot">
                  {Object.entries(PIVOT_AXIS_INFO).map(([value, info]) => (
                    <option key={value} value={value}>
                      {info.label}
                    </option>
                  ))}
                </optgroup>
              </NativeSelect.Field>
              <NativeSelect.Indicator />
            </NativeSelect.Root>
            <Field.ErrorText>{errors?.parameter?.message}</Field.ErrorText>
          </Field.Root>
          <Field.Root>
            <Field.Label>{label('kind')}</Field.Label>
            <NativeSelect.Root>
              <NativeSelect.Field bg="bg.panel" {...register(`${name}.kind`)}>
                <option value="range">Range: min, max, count</option>
                <option value="list">Pasted list of values</option>
              </NativeSelect.Field>
              <NativeSelect.Indicator />
            </NativeSelect.Root>
          </Field.Root>
        </SimpleGrid>

        {kind === 'range' ? (
          <SimpleGrid columns={{ base: 2, md: 4 }} gap="4">
            <Field.Root invalid={!!errors?.min}>
              <Field.Label>{label('min')}</Field.Label>
              <Input type="number" step="any" bg="bg.panel" fontFamily="mono" {...numberField('min')} />
              <Field.ErrorText>{errors?.min?.message}</Field.ErrorText>
            </Field.Root>
            <Field.Root invalid={!!errors?.max}>
              <Field.Label>{label('max')}</Field.Label>
              <Input type="number" step="any" bg="bg.panel" fontFamily="mono" {...numberField('max')} />
              <Field.ErrorText>{errors?.max?.message}</Field.ErrorText>
            </Field.Root>
            <Field.Root invalid={!!errors?.count}>
              <Field.Label>{label('count')}</Field.Label>
              <Input type="number" step="1" min="1" bg="bg.panel" fontFamily="mono" {...numberField('count')} />
              <Field.ErrorText>{errors?.count?.message}</Field.ErrorText>
            </Field.Root>
            <Field.Root>
              <Field.Label>{label('spacing')}</Field.Label>
              <NativeSelect.Root>
                <NativeSelect.Field bg="bg.panel" {...register(`${name}.spacing`)}>
                  <option value="linear">Linear</option>
                  <option value="log">Logarithmic</option>
                </NativeSelect.Field>
                <NativeSelect.Indicator />
              </NativeSelect.Root>
            </Field.Root>
          </SimpleGrid>
        ) : (
          <Field.Root invalid={!!errors?.values}>
            <Field.Label>{label('values')}</Field.Label>
            <Textarea bg="bg.panel" fontFamily="mono" rows={3} placeholder="0.5, 1, 2, 4" {...register(`${name}.values`)} />
            <Field.HelperText>Numbers separated by commas, spaces or new lines, in the order to run them.</Field.HelperText>
            <Field.ErrorText>{firstMessage(errors?.values)}</Field.ErrorText>
          </Field.Root>
        )}
      </Stack>
    </Fieldset.Root>
  );
}
