import type { ScanGridSlice } from '@sixtyfold/shared';

/**
 * The slices of finished scans, least recently used first out, bounded by their cells in all (a
 * 200 × 200 slice holds 40,000). A finished scan's points change
 * only when a retry reopens it, which changes its status and later its finishedAt, so a key that
 * holds both never finds a slice of the scan as it was before.
 */
export class GridSliceCache {
  private readonly slices = new Map<string, { slice: ScanGridSlice; cells: number }>();
  private cells = 0;

  constructor(private readonly maxCells: number) {}

  get(key: string): ScanGridSlice | undefined {
    const entry = this.slices.get(key);
    if (!entry) return undefined;
    // Map keeps insertion order: taking it out and back in makes it the most recent.
    this.slices.delete(key);
    this.slices.set(key, entry);
    return entry.slice;
  }

  set(key: string, slice: ScanGridSlice): void {
    const cells = slice.ok.length;
    if (cells > this.maxCells) return;
    this.delete(key);
    this.slices.set(key, { slice, cells });
    this.cells += cells;
    for (const [oldest] of this.slices) {
      if (this.cells <= this.maxCells) break;
      this.delete(oldest);
    }
  }

  private delete(key: string): void {
    const entry = this.slices.get(key);
    if (!entry) return;
    this.slices.delete(key);
    this.cells -= entry.cells;
  }
}
