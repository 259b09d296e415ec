import type { ConstraintRegion } from '@sixtyfold/shared';
import type { ReactNode } from 'react';

/**
 * How a plane view gets the constraint regions to draw: a hook the page passes in (the
 * constraint-regions feature's useRegionOverlay), so the scans feature need not know where
 * regions come from. Pass the same function on every render, as for any hook.
 */
export type UseRegionOverlay = (groupIds: number[]) => { shown: ConstraintRegion[]; toggles: ReactNode };
