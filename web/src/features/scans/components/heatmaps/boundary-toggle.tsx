import { Checkbox } from '@chakra-ui/react';

/** Switches the likelihood sets' 68 and 95 % boundary lines over the heatmaps. */
export function BoundaryToggle({ checked, onChange }: { checked: boolean; onChange: (checked: boolean) => void }) {
  return (
    <Checkbox.Root checked={checked} onCheckedChange={(details) => onChange(details.checked === true)} colorPalette="ember" size="sm" pb="2">
      <Checkbox.HiddenInput />
      <Checkbox.Control />
      <Checkbox.Label>68/95 % boundaries</Checkbox.Label>
    </Checkbox.Root>
  );
}
