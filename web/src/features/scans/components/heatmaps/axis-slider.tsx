import { HStack, Slider, Text } from '@chakra-ui/react';
import { useEffect, useState } from 'react';
import { formatNumber } from '@/lib/format-number';
import { inputLabel } from '@/lib/point-labels';

interface AxisSliderProps {
  parameter: string;
  values: number[];
  index: number;
  onChange: (index: number) => void;
}

// Long enough to skip the steps of a drag or held arrow key, short enough to feel immediate.
const SETTLE_MS = 250;

/** Holds an axis that is neither x nor y at one of its values; arrow keys step through them. */
export function AxisSlider({ parameter, values, index, onChange }: AxisSliderProps) {
  const [draft, setDraft] = useState(index);
  useEffect(() => setDraft(index), [index]);
  useEffect(() => {
    if (draft === index) return;
    const timer = setTimeout(() => onChange(draft), SETTLE_MS);
    return () => clearTimeout(timer);
  }, [draft, index, onChange]);

  const label = inputLabel(parameter);
  const valueText = (i: number) => `${formatNumber(values[i])} (value ${i + 1} of ${values.length})`;
  return (
    <Slider.Root
      minW={{ base: 'full', sm: '64' }}
      flex="1"
      size="sm"
      colorPalette="ember"
      min={0}
      max={values.length - 1}
      step={1}
      value={[draft]}
      onValueChange={(details) => setDraft(details.value[0])}
      getAriaValueText={(details) => valueText(details.value)}
    >
      <HStack justify="space-between">
        <Slider.Label fontSize="sm">{label}</Slider.Label>
        <Text fontFamily="mono" fontSize="sm" color="ink.900">
          {label} = {formatNumber(values[draft])}
          <Text as="span" color="fg.muted">
            {' '}
            ({draft + 1}/{values.length})
          </Text>
        </Text>
      </HStack>
      <Slider.Control>
        <Slider.Track>
          <Slider.Range />
        </Slider.Track>
        <Slider.Thumbs />
      </Slider.Control>
    </Slider.Root>
  );
}
