import type { ConstraintRegion } from '@sixtyfold/shared';
import { useQueries, type UseQueryResult } from '@tanstack/react-query';
import { useMemo, useState, type ReactNode } from 'react';
import { getConstraintRegionsQueryOptions } from '../api/get-constraint-regions';
import { RegionToggles } from '../components/region-toggles';

export interface RegionOverlay {
  /** The regions switched on, to draw on the plane. */
  shown: ConstraintRegion[];
  /** One switch per region; null while the groups have none. */
  toggles: ReactNode;
}

// Module-level, so useQueries keeps the combined list while no query changes (the plane redraws less).
const allRegions = (results: UseQueryResult<ConstraintRegion[]>[]) => results.flatMap((result) => result.data ?? []);

/**
 * The uploaded regions of some groups (each group once) over an n_s–r plane: all drawn until
 * switched off, per visit, not in the address. Pages hand it to the scans' plane views.
 */
export function useRegionOverlay(groupIds: number[]): RegionOverlay {
  const regions = useQueries({ queries: [...new Set(groupIds)].map((groupId) => getConstraintRegionsQueryOptions(groupId)), combine: allRegions });
  const [hidden, setHidden] = useState<ReadonlySet<number>>(new Set());
  const shown = useMemo(() => regions.filter((region) => !hidden.has(region.id)), [regions, hidden]);
  return { shown, toggles: regions.length > 0 ? <RegionToggles regions={regions} hidden={hidden} onChange={setHidden} /> : null };
}
