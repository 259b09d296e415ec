import { Checkbox, Field, HStack, SegmentGroup } from '@chakra-ui/react';
import { SelectField } from '@/components/ui/select-field';
import { useId, type ReactNode } from 'react';
import { outputLabel } from '../../utils/output-labels';
import { inputLabel } from '@/lib/point-labels';

export interface PlaneSettings {
  colorBy: string | null;
  rScale: 'linear' | 'log';
  references: boolean;
}

interface PlaneControlsProps {
  settings: PlaneSettings;
  onChange: (changes: Partial<PlaneSettings>) => void;
  /** What points may be coloured by; none hides the choice (several scans get a colour each). */
  colorOptions?: string[];
  /** The likelihood set picker, beside the other settings. */
  children?: ReactNode;
}

/** Colour, likelihood sets, r scale and reference lines of an n_s–r plane. */
export function PlaneControls({ settings, onChange, colorOptions = [], children }: PlaneControlsProps) {
  const scaleLabel = useId();
  return (
    <HStack gap="4" wrap="wrap" align="end">
      {colorOptions.length > 0 && (
        <SelectField
          label="Colour by"
          value={settings.colorBy ?? ''}
          options={colorOptions.map((name) => ({ value: name, label: name === 'deltaChi2' ? `${outputLabel(name)} under the set` : inputLabel(name) }))}
          onChange={(colorBy) => onChange({ colorBy })}
          minW="40"
        />
      )}
      {children}
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
