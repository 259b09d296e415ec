import { Checkbox, Fieldset, Stack } from '@chakra-ui/react';
import type { ConstraintRegion } from '@sixtyfold/shared';
import { regionLabel } from '@/lib/region-labels';

interface RegionTogglesProps {
  regions: ConstraintRegion[];
  /** Ids of the regions not drawn. */
  hidden: ReadonlySet<number>;
  onChange: (hidden: Set<number>) => void;
}

/** One switch per uploaded constraint region of the group (or groups, when comparing), to draw its outline on the plane or not. */
export function RegionToggles({ regions, hidden, onChange }: RegionTogglesProps) {
  if (regions.length === 0) return null;
  const toggle = (id: number, shown: boolean) => {
    const next = new Set(hidden);
    if (shown) next.delete(id);
    else next.add(id);
    onChange(next);
  };
  return (
    <Fieldset.Root size="sm">
      <Fieldset.Legend fontSize="sm">{new Set(regions.map((r) => r.groupId)).size > 1 ? 'Your groups’' : 'Your group’s'} constraint regions</Fieldset.Legend>
      <Stack gap="1">
        {regions.map((region) => (
          <Checkbox.Root
            key={region.id}
            checked={!hidden.has(region.id)}
            onCheckedChange={(details) => toggle(region.id, details.checked === true)}
            colorPalette="ember"
            size="sm"
          >
            <Checkbox.HiddenInput />
            <Checkbox.Control />
            <Checkbox.Label>{regionLabel(region)}</Checkbox.Label>
          </Checkbox.Root>
        ))}
      </Stack>
    </Fieldset.Root>
  );
}
