import { z } from 'zod';
import { POINT_OUTPUTS } from './scan-point.schema.js';
import { buildInfoSchema } from './scan-provenance.schema.js';

/** Points a check recomputes unless asked otherwise, and the most it may ask for. */
export const DEFAULT_REPRODUCTION_SAMPLE = 20;
export const MAX_REPRODUCTION_SAMPLE = 1000;

/** `POST /api/scans/:id/reproductions`: how many of the scan's OK points to recompute, chosen at random. */
export const createReproductionSchema = z.object({
  sampleSize: z
    .number({ error: 'sampleSize must be a whole number' })
    .int('sampleSize must be a whole number')
    .min(1, 'sampleSize must be at least 1')
    .max(MAX_REPRODUCTION_SAMPLE, `sampleSize is at most ${MAX_REPRODUCTION_SAMPLE}`)
    .default(DEFAULT_REPRODUCTION_SAMPLE),
});
export type CreateReproduction = z.infer<typeof createReproductionSchema>;

export const REPRODUCTION_STATUSES = ['queued', 'running', 'completed', 'failed'] as const;
export type ReproductionStatus = (typeof REPRODUCTION_STATUSES)[number];

const outputs = Object.fromEntries(POINT_OUTPUTS.map((o) => [o, z.number().nullable()])) as Record<(typeof POINT_OUTPUTS)[number], z.ZodNullable<z.ZodNumber>>;

/** One point as stored or as recomputed: its status and outputs (null where there are none). */
export const reproducedPointSchema = z.object({ pointIndex: z.number().int(), status: z.string(), ...outputs });
export type ReproducedPoint = z.infer<typeof reproducedPointSchema>;

/** One output over the sample: identical bit for bit, or the largest relative difference and where. */
export const reproductionOutputSchema = z.object({
  output: z.enum(POINT_OUTPUTS),
  /** Points where both have a value, or both none. */
  compared: z.number().int(),
  identical: z.boolean(),
  /** Points whose value differs in any bit (or is present on one side only). */
  differing: z.number().int(),
  /** max |a − b| / max(|a|, |b|) over the points with a value on both sides; null when none differs so. */
  maxRelativeDifference: z.number().nullable(),
  atPointIndex: z.number().int().nullable(),
});
export type ReproductionOutput = z.infer<typeof reproductionOutputSchema>;

export const reproductionReportSchema = z.object({
  /** Every output of every point identical bit for bit, statuses included. */
  identical: z.boolean(),
  outputs: z.array(reproductionOutputSchema),
  /** Points whose status changed (an OK point that now fails, say). */
  statusChanges: z.array(z.object({ pointIndex: z.number().int(), stored: z.string(), recomputed: z.string() })),
});
export type ReproductionReport = z.infer<typeof reproductionReportSchema>;

/** One check: the sample, the builds involved and, once done, the report. */
export const reproductionSchema = z.object({
  id: z.number().int(),
  scanId: z.number().int(),
  status: z.enum(REPRODUCTION_STATUSES),
  sampleSize: z.number().int(),
  pointIndices: z.array(z.number().int()),
  requestedByName: z.string().nullable(),
  requestedAt: z.string(),
  finishedAt: z.string().nullable(),
  /** The build the scan was submitted with; null when its provenance was not recorded. */
  scanBuild: buildInfoSchema.nullable(),
  /** The worker that recomputed the sample, and its build. */
  checkedBuild: buildInfoSchema.extend({ worker: z.string() }).nullable(),
  report: reproductionReportSchema.nullable(),
  error: z.string().nullable(),
});
export type Reproduction = z.infer<typeof reproductionSchema>;

/** `GET /api/scans/:id/reproductions`: today's build beside the scan's, then the checks, newest first. */
export const reproductionListSchema = z.object({
  today: buildInfoSchema,
  scanBuild: buildInfoSchema.nullable(),
  items: z.array(reproductionSchema),
});
export type ReproductionList = z.infer<typeof reproductionListSchema>;
