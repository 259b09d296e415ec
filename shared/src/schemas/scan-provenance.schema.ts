import { z } from 'zod';
import { scanMethodSchema } from './scan-summary.schema.js';

/** What a process is built from: the engine version, the git commit ("unknown" when it could not be read) and Node's version. */
export const buildInfoSchema = z.object({
  engineVersion: z.string(),
  commit: z.string(),
  node: z.string(),
});
export type BuildInfo = z.infer<typeof buildInfoSchema>;

const integrator = z.literal('cash-karp-rk45');

/** The integrator settings a scan's points run with (`resolvedEngineOptions`). */
export const resolvedEngineOptionsSchema = z.object({
  method: scanMethodSchema,
  background: z.object({ integrator, tolerance: z.number(), maxStep: z.number(), lookAheadAfter: z.number(), fieldLimit: z.number() }),
  modes: z
    .object({
      integrator, startDepth: z.number(), resonanceSafety: z.number(), adiabaticSafety: z.number(), endDepth: z.number(),
      tolerance: z.number(), stencil: z.number(), maxStep: z.number(),
    })
    .nullable(),
  budget: z.object({ evaluations: z.number(), steps: z.number(), wallTimeMs: z.number().nullable() }),
});

/**
 * What a scan records at submission (`scans.provenance`; null for scans stored before it was
 * recorded): the submitting build, the resolved integrator settings, and the SHA-256 of the stored
 * spec's canonical JSON (`canonicalJson`).
 */
export const scanProvenanceSchema = buildInfoSchema.extend({
  specSha256: z.string().regex(/^[0-9a-f]{64}$/),
  engineOptions: resolvedEngineOptionsSchema,
});
export type ScanProvenance = z.infer<typeof scanProvenanceSchema>;

/** One run of a chunk job on a worker (`scan_chunk_runs`); a retried chunk has a run per attempt that stored. */
export const chunkRunSchema = buildInfoSchema.extend({
  chunk: z.number().int(),
  /** Positions [start, end) in the scan's compute order. */
  start: z.number().int(),
  end: z.number().int(),
  /** `hostname:pid` of the worker process. */
  worker: z.string(),
  /** The worker's wall-time limit per point. */
  pointTimeLimitMs: z.number(),
  startedAt: z.iso.datetime(),
  finishedAt: z.iso.datetime(),
});
export type ChunkRun = z.infer<typeof chunkRunSchema>;

/** The runs of one worker process, summed. */
export const workerRunsSchema = buildInfoSchema.extend({
  worker: z.string(),
  runs: z.number().int(),
  points: z.number().int(),
  firstStartedAt: z.iso.datetime(),
  lastFinishedAt: z.iso.datetime(),
});

/** `GET /api/scans/:id/provenance`: what computed the scan. */
export const scanProvenanceAnswerSchema = z.object({
  scanId: z.number().int(),
  /** Null: the scan was stored before provenance was recorded ("not recorded"). */
  recorded: scanProvenanceSchema.nullable(),
  /** False for a scan stored before chunk runs were recorded: its chunks' workers are unknown. */
  runsRecorded: z.boolean(),
  workers: z.array(workerRunsSchema),
  runs: z.array(chunkRunSchema),
});
export type ScanProvenanceAnswer = z.infer<typeof scanProvenanceAnswerSchema>;
