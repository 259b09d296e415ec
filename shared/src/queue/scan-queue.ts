import { z } from 'zod';
import type { ScanMethod } from '../schemas/scan-summary.schema.js';

/** The API ↔ worker contract for scan work carried by Redis (bull). */
export const SCAN_QUEUE = 'scan-chunks';
export const COMPUTE_CHUNK_JOB = 'compute-chunk';

/** Most points per chunk: about a second on one core (see `npm run bench`). */
export const MAX_CHUNK_POINTS: Record<ScanMethod, number> = { slowroll: 2000, exact: 200 };
/**
 * A smaller scan is cut into at least this many chunks (down to an eighth of the maximum size),
 * so that every worker of the pool gets a share and none is left finishing alone.
 */
const MIN_CHUNKS = 16;

/** Points per chunk of a scan; it depends only on the scan's size and method, which never change. */
export function chunkSize(total: number, method: ScanMethod): number {
  const most = MAX_CHUNK_POINTS[method];
  return Math.min(most, Math.max(Math.ceil(most / 8), Math.ceil(total / MIN_CHUNKS)));
}

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

/** Scan and chunk of a chunk job id, or null for any other id. */
export function parseChunkJobId(jobId: string): { scanId: number; chunk: number } | null {
  const match = /^scan-(\d+)-chunk-(\d+)$/.exec(jobId);
  return match ? { scanId: Number(match[1]), chunk: Number(match[2]) } : null;
}

/** Points [start, end) of one chunk of a scan of `total` points. */
export function chunkPoints(total: number, method: ScanMethod, chunk: number): number {
  const size = chunkSize(total, method);
  return Math.max(0, Math.min(total, (chunk + 1) * size) - chunk * size);
}

/** The chunks of a scan of `total` points. */
export function scanChunks(scanId: number, total: number, method: ScanMethod): ComputeChunkJob[] {
  const size = chunkSize(total, method);
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
