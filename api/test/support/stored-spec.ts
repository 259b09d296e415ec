import { storedScanSpecSchema, type StoredScanSpec } from '@sixtyfold/shared';

/**
 * A complete stored spec for scans a test inserts directly (the `scans.spec` column reads back
 * only through the shared schema): natural inflation over f and N_*, 2 × 2 points, unless changed.
 */
export function storedSpec(groupId: number, change: Partial<StoredScanSpec> = {}): StoredScanSpec {
  return storedScanSpecSchema.parse({
    groupId, name: 'inserted by a test', tags: [], note: '', model: { kind: 'family', family: 'natural' }, params: {},
    axes: [{ kind: 'list', parameter: 'f', values: [5, 7] }, { kind: 'list', parameter: 'nStar', values: [50, 60] }],
    pivot: { kind: 'fixed' }, method: 'slowroll', potentialSource: 'natural',
    ...change,
  });
}
