import { Checkbox, Field, HStack, NativeSelect, SegmentGroup } from '@chakra-ui/react';
import { useId } from 'react';
import { inputLabel } from '../../utils/point-columns';
import { LimitSetSelect } from '../limit-set-select';

export interface PlaneSettings {
  colorBy: string | null;
  limitsKey: string;
  rScale: 'linear' | 'log';
  references: boolean;
}

interface PlaneControlsProps {
  settings: PlaneSettings;
  onChange: (changes: Partial<PlaneSettings>) => void;
  /** What points may be coloured by; none hides the choice (several scans get a colour each). */
  colorOptions?: string[];
}

/** Colour, limit set, r scale and reference lines of an n_s–r plane. */
export function PlaneControls({ settings, onChange, colorOptions = [] }: PlaneControlsProps) {
  const scaleLabel = useId();
  return (
    <HStack gap="4" wrap="wrap" align="end">
      {colorOptions.length > 0 && (
        <Field.Root w="auto" minW="40">
          <Field.Label fontSize="sm">Colour by</Field.Label>
          <NativeSelect.Root size="sm">
            <NativeSelect.Field bg="bg.panel" value={settings.colorBy ?? ''} onChange={(event) => onChange({ colorBy: event.target.value })}>
              {colorOptions.map((name) => (
                <option key={name} value={name}>
                  {inputLabel(name)}
                </option>
              ))}
            </NativeSelect.Field>
            <NativeSelect.Indicator />
          </NativeSelect.Root>
        </Field.Root>
      )}
      <LimitSetSelect value={settings.limitsKey} onChange={(limitsKey) => onChange({ limitsKey })} />
      <Field.Root w="auto">
        <Field.Label fontSize="sm" id={scaleLabel}>
          r axis
        </Field.Label>
        <SegmentGroup.Root
          size="sm"
          value={settings.rScale}
          onValueChange={(details) => onChange({ rScale: details.value === 'log' ? 'log' : 'linear' })}
          aria-labelledby={scaleLabel}
        >
          <SegmentGroup.Indicator />
          <SegmentGroup.Items items={[{ value: 'linear', label: 'Linear' }, { value: 'log', label: 'Log' }]} />
        </SegmentGroup.Root>
      </Field.Root>
      <Checkbox.Root
        checked={settings.references}
        onCheckedChange={(details) => onChange({ references: details.checked === true })}
        colorPalette="ember"
        size="sm"
        pb="2"
      >
        <Checkbox.HiddenInput />
        <Checkbox.Control />
        <Checkbox.Label>Reference lines (φ^p, α-attractors)</Checkbox.Label>
      </Checkbox.Root>
    </HStack>
  );
}
