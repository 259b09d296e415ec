import type { ConstraintRegion } from '@sixtyfold/shared';
import { useMemo, useState } from 'react';

/** Which uploaded regions a plane draws: all of them until switched off (per visit, not in the address). */
export function useRegionToggles(regions: ConstraintRegion[] | undefined) {
  const [hidden, setHidden] = useState<ReadonlySet<number>>(new Set());
  const shown = useMemo(() => (regions ?? []).filter((r) => !hidden.has(r.id)), [regions, hidden]);
  return { hidden, setHidden, shown };
}
