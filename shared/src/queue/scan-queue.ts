import { z } from 'zod';
import type { ScanMethod } from '../schemas/scan-summary.schema.js';

/** The API ↔ worker contract for scan work carried by Redis (bull). */
export const SCAN_QUEUE = 'scan-chunks';
export const COMPUTE_CHUNK_JOB = 'compute-chunk';

/**
 * Most points per chunk. Slow roll: 10,000, under a second on one core where points share
 * backgrounds (tens of µs a point) and ~5 s where each integrates its own, well inside a time slice;
 * fewer, larger chunks spend less on bookkeeping (a job, a transaction, the counters) per point.
 * Exact: 200, about a second.
 */
export const MAX_CHUNK_POINTS: Record<ScanMethod, number> = { slowroll: 10_000, exact: 200 };
/** Fewest points per chunk: tiny chunks would cost more in bookkeeping than they spread. */
const MIN_CHUNK_POINTS: Record<ScanMethod, number> = { slowroll: 250, exact: 25 };
/**
 * A smaller scan is cut into at least this many chunks (down to MIN_CHUNK_POINTS),
 * so that every worker of the pool gets a share and none is left finishing alone.
 */
const MIN_CHUNKS = 16;

/** Points per chunk of a scan; it depends only on the scan's size and method, which never change. */
export function chunkSize(total: number, method: ScanMethod): number {
  return Math.min(MAX_CHUNK_POINTS[method], Math.max(MIN_CHUNK_POINTS[method], Math.ceil(total / MIN_CHUNKS)));
}

/** Job data: ids only; the worker reads the scan itself from MariaDB. */
export const computeChunkJobSchema = z.object({
  scanId: z.number().int().positive(),
  chunk: z.number().int().min(0),
  /** Point indices [start, end): the whole chunk, or for a continuation the rest of it. */
  start: z.number().int().min(0),
  end: z.number().int().min(1),
  /** Time slices the chunk has had before this job: absent for a chunk's first job, 1 or more for a continuation. */
  slices: z.number().int().min(1).optional(),
});
export type ComputeChunkJob = z.infer<typeof computeChunkJobSchema>;

/**
 * Deterministic job id, so enqueueing the same work twice adds nothing: `scan-<id>-chunk-<n>` for a
 * chunk, `scan-<id>-chunk-<n>-from-<point>` for the continuation that computes the rest of it from
 * that point on.
 */
export function chunkJobId(scanId: number, chunk: number, from?: number): string {
  return from === undefined ? `scan-${scanId}-chunk-${chunk}` : `scan-${scanId}-chunk-${chunk}-from-${from}`;
}

/** The id of a chunk job, from its data. */
export function jobIdOf(job: ComputeChunkJob): string {
  return job.slices ? chunkJobId(job.scanId, job.chunk, job.start) : chunkJobId(job.scanId, job.chunk);
}

/** Scan, chunk and (for a continuation) first point of a chunk job id, or null for any other id. */
export function parseChunkJobId(jobId: string): { scanId: number; chunk: number; from: number | null } | null {
  const match = /^scan-(\d+)-chunk-(\d+)(?:-from-(\d+))?$/.exec(jobId);
  return match ? { scanId: Number(match[1]), chunk: Number(match[2]), from: match[3] === undefined ? null : Number(match[3]) } : null;
}

/** Points [start, end) of one chunk of a scan of `total` points. */
export function chunkPoints(total: number, method: ScanMethod, chunk: number): number {
  const size = chunkSize(total, method);
  return Math.max(0, Math.min(total, (chunk + 1) * size) - chunk * size);
}

/** Points a job with this id computes: its whole chunk, or for a continuation the chunk's rest from its first point. */
export function jobPoints(total: number, method: ScanMethod, id: { chunk: number; from: number | null }): number {
  const points = chunkPoints(total, method, id.chunk);
  if (id.from === null) return points;
  const end = id.chunk * chunkSize(total, method) + points;
  return Math.max(0, end - id.from);
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
 * Bull priority of a chunk (1 is first, kept free). The k-th chunk of a scan gets 2 + k, so the first chunks of a colleague's small scan go ahead of the thousandth chunk
 * of an overnight one: every scan advances, none starves.
 */
export function chunkPriority(chunk: number): number {
  return Math.min(2 + chunk, 2_000_000);
}

/**
 * What one time slice of a chunk counts as, in chunks: a slice (30 s by default) is the work of
 * about 30 ordinary chunks of a second. A continuation goes back behind that many more chunks
 * for each slice its chunk has had, so a scan whose points are slow gets its share of the pool,
 * not all of it, and the waiting chunks of other scans run in between.
 */
export const SLICE_PRIORITY_STEP = 30;

/** Bull priority of a chunk job: its chunk's, pushed back by the slices the chunk has already had. */
export function jobPriority(job: ComputeChunkJob): number {
  return Math.min(chunkPriority(job.chunk) + (job.slices ?? 0) * SLICE_PRIORITY_STEP, 2_000_000);
}

/** Attempts a chunk job gets (with exponential back-off) before its points are stored as `chunk_failed`. */
export const CHUNK_JOB_ATTEMPTS = 5;

/** The bull options of a chunk job, the same wherever it is enqueued (the API, or a worker handing on a continuation). */
export function chunkJobOptions(job: ComputeChunkJob) {
  return {
    jobId: jobIdOf(job),
    priority: jobPriority(job),
    attempts: CHUNK_JOB_ATTEMPTS,
    backoff: { type: 'exponential', delay: 2000 },
    removeOnComplete: true,
    removeOnFail: 1000,
  };
}

/** The job that computes the rest of a chunk from point `from`, after `job` used up its time slice there. */
export function continuationOf(job: ComputeChunkJob, from: number): ComputeChunkJob {
  return { scanId: job.scanId, chunk: job.chunk, start: from, end: job.end, slices: (job.slices ?? 0) + 1 };
}
