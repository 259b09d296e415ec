import { z } from 'zod';
import type { ScanMethod } from '../schemas/scan-summary.schema.js';

/** The API ↔ worker contract for scan work carried by Redis (bull). */
export const SCAN_QUEUE = 'scan-chunks';
export const COMPUTE_CHUNK_JOB = 'compute-chunk';

/** Points per chunk, so that one chunk takes about a second on one core (see `npm run bench`). */
export const CHUNK_POINTS: Record<ScanMethod, number> = { slowroll: 2000, exact: 200 };

/** Job data: ids only; the worker reads the scan itself from MariaDB. */
export const computeChunkJobSchema = z.object({
  scanId: z.number().int().positive(),
  chunk: z.number().int().min(0),
  /** Point indices [start, end). */
  start: z.number().int().min(0),
  end: z.number().int().min(1),
});
export type ComputeChunkJob = z.infer<typeof computeChunkJobSchema>;

/** Deterministic job id, so enqueueing the same chunk twice adds nothing. */
export function chunkJobId(scanId: number, chunk: number): string {
  return `scan-${scanId}-chunk-${chunk}`;
}

/** The chunks of a scan of `total` points. */
export function scanChunks(scanId: number, total: number, method: ScanMethod): ComputeChunkJob[] {
  const size = CHUNK_POINTS[method];
  const chunks: ComputeChunkJob[] = [];
  for (let chunk = 0, start = 0; start < total; chunk++, start += size) {
    chunks.push({ scanId, chunk, start, end: Math.min(total, start + size) });
  }
  return chunks;
}

/**
 * Bull priority of a chunk (1 is first). Interactive previews get 1; the k-th chunk of a scan
 * gets 2 + k, so the first chunks of a colleague's small scan go ahead of the thousandth chunk
 * of an overnight one: every scan advances, none starves.
 */
export function chunkPriority(chunk: number): number {
  return Math.min(2 + chunk, 2_000_000);
}
export const PREVIEW_PRIORITY = 1;
