import { Box, Code, Field, Fieldset, Input, NativeSelect, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { POTENTIAL_FAMILIES, type ModelParameter, type PotentialModel } from '@sixtyfold/shared';
import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import type { ChosenModel } from './scan-form-edits';
import { familyModelKey, firstMessage, groupModelKey, toNumber, type ScanFormValues } from './scan-form-values';

interface PotentialFieldsProps {
  register: UseFormRegister<ScanFormValues>;
  errors: FieldErrors<ScanFormValues>;
  /** The chosen model's key ("family:<key>" or "group:<id>"), and the model itself unless it left the group. */
  modelKey: string;
  model: ChosenModel | undefined;
  /** The chosen group's models, offered after the families, and the group's name. */
  groupModels: PotentialModel[];
  groupName: string;
  /** The model's parameters no axis or column varies. */
  fixedParameters: ModelParameter[];
  onModelChange: (modelKey: string) => void;
}

/** The model (a family or one of the group's), its fixed parameters and φ_init. */
export function PotentialFields({ register, errors, modelKey, model, groupModels, groupName, fixedParameters, onModelChange }: PotentialFieldsProps) {
  return (
    <Fieldset.Root>
      <Fieldset.Legend fontSize="md" fontWeight="600" color="ink.900" mb="3">
        Potential
      </Fieldset.Legend>
      <Stack gap="4">
        <Field.Root invalid={!!errors.model || !model}>
          <Field.Label>Model</Field.Label>
          <NativeSelect.Root>
            <NativeSelect.Field
              bg="bg.panel"
              {...register('model')}
              // Controlled: its options depend on the group, and a changing option list must keep the choice.
              value={modelKey}
              onChange={(event) => onModelChange(event.target.value)}
            >
              <optgroup label="Built-in families">
                {POTENTIAL_FAMILIES.map((family) => (
                  <option key={family.key} value={familyModelKey(family.key)}>
                    {family.name}
                  </option>
                ))}
              </optgroup>
              {groupModels.length > 0 && (
                <optgroup label={`Models of ${groupName}`}>
                  {groupModels.map((m) => (
                    <option key={m.id} value={groupModelKey(m.id)}>
                      {m.name}
                    </option>
                  ))}
                </optgroup>
              )}
              {!model && <option value={modelKey}>A model that is no longer available</option>}
            </NativeSelect.Field>
            <NativeSelect.Indicator />
          </NativeSelect.Root>
          {model ? (
            <Field.HelperText>
              V(φ) ={' '}
              <Code fontFamily="mono" fontSize="xs" bg="ink.subtle" color="ink.fg" whiteSpace="normal" wordBreak="break-word">
                {model.expression}
              </Code>
              {model.reference && <> · {model.reference}</>}
            </Field.HelperText>
          ) : (
            <Field.ErrorText>This model is not in the chosen group any more; choose another.</Field.ErrorText>
          )}
          <Field.ErrorText>{firstMessage(errors.model)}</Field.ErrorText>
        </Field.Root>

        {fixedParameters.length > 0 && (
          <Box>
            <Text fontSize="sm" fontWeight="500" mb="2">
              Fixed parameters
            </Text>
            <SimpleGrid columns={{ base: 1, sm: 2, lg: 3 }} gap="4">
              {fixedParameters.map((p) => (
                <Field.Root key={p.name} invalid={!!errors.params?.[p.name]}>
                  <Field.Label fontFamily="mono">{p.name}</Field.Label>
                  <Input type="number" step="any" bg="bg.panel" fontFamily="mono" {...register(`params.${p.name}`, { setValueAs: toNumber })} />
                  {p.description && <Field.HelperText>{p.description}</Field.HelperText>}
                  <Field.ErrorText>{errors.params?.[p.name]?.message}</Field.ErrorText>
                </Field.Root>
              ))}
            </SimpleGrid>
          </Box>
        )}

        <Field.Root invalid={!!errors.phiInit} maxW={{ md: 'xs' }}>
          <Field.Label>φ_init</Field.Label>
          <Input type="number" step="any" bg="bg.panel" fontFamily="mono" {...register('phiInit', { setValueAs: toNumber })} />
          <Field.HelperText>
            {modelKey.startsWith('family:')
              ? 'Optional: a built-in family starts about 75 e-folds before the end of inflation.'
              : 'Where the field starts rolling, from the model unless you change it.'}
          </Field.HelperText>
          <Field.ErrorText>{errors.phiInit?.message}</Field.ErrorText>
        </Field.Root>
      </Stack>
    </Fieldset.Root>
  );
}
