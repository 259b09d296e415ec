import { Field, NativeSelect } from '@chakra-ui/react';

export interface SelectOption {
  value: string;
  label: string;
}

interface SelectFieldProps {
  label: string;
  value: string;
  options: SelectOption[];
  onChange: (value: string) => void;
  minW?: string;
}

/** A small labelled native select for view settings (axes, outputs, limit sets). */
export function SelectField({ label, value, options, onChange, minW = '36' }: SelectFieldProps) {
  return (
    <Field.Root w="auto" minW={minW}>
      <Field.Label fontSize="sm">{label}</Field.Label>
      <NativeSelect.Root size="sm">
        <NativeSelect.Field bg="bg.panel" value={value} onChange={(event) => onChange(event.target.value)}>
          {options.map((option) => (
            <option key={option.value} value={option.value}>
              {option.label}
            </option>
          ))}
        </NativeSelect.Field>
        <NativeSelect.Indicator />
      </NativeSelect.Root>
    </Field.Root>
  );
}
