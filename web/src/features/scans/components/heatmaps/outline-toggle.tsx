import { Checkbox } from '@chakra-ui/react';

/** Switches the outline of the cells inside the observational limits. */
export function OutlineToggle({ checked, onChange }: { checked: boolean; onChange: (checked: boolean) => void }) {
  return (
    <Checkbox.Root checked={checked} onCheckedChange={(details) => onChange(details.checked === true)} colorPalette="ember" size="sm" pb="2">
      <Checkbox.HiddenInput />
      <Checkbox.Control />
      <Checkbox.Label>Outline cells inside the limits</Checkbox.Label>
    </Checkbox.Root>
  );
}
