import { chunkSize, computeOrder, type ScanMethod, type StoredScanSpec } from '@sixtyfold/shared';

/**
 * The SQL expression for the chunk a stored point belongs to: its position in the scan's compute
 * order (`computeOrder`), divided by the chunk size. Written from integers only, so it is safe
 * to put into a statement; one chunk per row in a GROUP BY over the scan's points.
 */
export function chunkOfPointSql(spec: StoredScanSpec, total: number, method: ScanMethod): string {
  const size = chunkSize(total, method);
  const order = computeOrder(spec);
  if (order.identity) return `FLOOR(point_index / ${size})`;
  const position = order.terms.map((t) => `MOD(FLOOR(point_index / ${t.indexStride}), ${t.length}) * ${t.positionStride}`).join(' + ');
  return `FLOOR((${position}) / ${size})`;
}
