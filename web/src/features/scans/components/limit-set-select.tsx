import { Field, NativeSelect } from '@chakra-ui/react';
import { OBSERVATIONAL_LIMITS } from '@sixtyfold/shared';

/** Picks one of the published limit sets; each names its source wherever it is drawn. */
export function LimitSetSelect({ value, onChange }: { value: string; onChange: (key: string) => void }) {
  return (
    <Field.Root w="auto" minW="56">
      <Field.Label fontSize="sm">Observational limits</Field.Label>
      <NativeSelect.Root size="sm">
        <NativeSelect.Field bg="bg.panel" value={value} onChange={(event) => onChange(event.target.value)}>
          {OBSERVATIONAL_LIMITS.map((limits) => (
            <option key={limits.key} value={limits.key}>
              {limits.label}
            </option>
          ))}
        </NativeSelect.Field>
        <NativeSelect.Indicator />
      </NativeSelect.Root>
    </Field.Root>
  );
}
