import { Field, Input, SimpleGrid } from '@chakra-ui/react';
import type { ModelParameter } from '@sixtyfold/shared';

interface ParameterFieldsProps {
  parameters: ModelParameter[];
  texts: Record<string, string>;
  errors: Record<string, string>;
  onChange: (name: string, text: string) => void;
}

function rangeNote(p: ModelParameter): string {
  if (p.min === undefined && p.max === undefined) return `default ${p.defaultValue}`;
  return `default ${p.defaultValue}; scans offer ${p.min ?? '…'} to ${p.max ?? '…'}`;
}

/** One text field per parameter, so values like 1e-10 can be typed as written. */
export function ParameterFields({ parameters, texts, errors, onChange }: ParameterFieldsProps) {
  return (
    <SimpleGrid columns={{ base: 1, sm: 2, lg: 3 }} gap="4">
      {parameters.map((p) => (
        <Field.Root key={p.name} invalid={errors[p.name] !== undefined}>
          <Field.Label fontFamily="mono">{p.name}</Field.Label>
          <Input
            value={texts[p.name] ?? ''}
            onChange={(event) => onChange(p.name, event.target.value)}
            inputMode="decimal"
            autoComplete="off"
            spellCheck={false}
            fontFamily="mono"
            bg="bg.panel"
          />
          {errors[p.name] ? (
            <Field.ErrorText>{errors[p.name]}</Field.ErrorText>
          ) : (
            <Field.HelperText>{[p.description, rangeNote(p)].filter(Boolean).join(' · ')}</Field.HelperText>
          )}
        </Field.Root>
      ))}
    </SimpleGrid>
  );
}
