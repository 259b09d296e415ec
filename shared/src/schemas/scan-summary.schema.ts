import { z } from 'zod';
import type { Method } from '../engine/evaluate-point.js';

export const SCAN_STATUSES = ['draft', 'queued', 'running', 'completed', 'failed', 'cancelled'] as const;
export const scanStatusSchema = z.enum(SCAN_STATUSES);
export type ScanStatus = z.infer<typeof scanStatusSchema>;
/** A scan in one of these has stopped: its points change only if a retry reopens it. */
export const FINISHED_SCAN_STATUSES: ReadonlySet<ScanStatus> = new Set(['completed', 'failed', 'cancelled']);

/** The engine's methods, listed once for scans, trial evaluations, forms and tables. */
export const SCAN_METHODS = ['slowroll', 'exact'] as const satisfies readonly Method[];
export const scanMethodSchema = z.enum(SCAN_METHODS);
export type ScanMethod = z.infer<typeof scanMethodSchema>;

/** A scan as lists show it: identity, owner, state and counters. */
export const scanSummarySchema = z.object({
  id: z.number().int(),
  groupId: z.number().int(),
  ownerId: z.number().int(),
  ownerName: z.string(),
  name: z.string(),
  method: scanMethodSchema,
  status: scanStatusSchema,
  tags: z.array(z.string()),
  totalPoints: z.number().int(),
  donePoints: z.number().int(),
  failedPoints: z.number().int(),
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
});
export type ScanSummary = z.infer<typeof scanSummarySchema>;

/** Progress of a scan, counted in points; running and queued come from the live queue. */
export const scanProgressSchema = z.object({
  total: z.number().int(),
  done: z.number().int(),
  failed: z.number().int(),
  running: z.number().int(),
  queued: z.number().int(),
  elapsedSeconds: z.number().nullable(),
  /** From the rate observed so far; null until there is one. */
  remainingSeconds: z.number().nullable(),
});
export type ScanProgress = z.infer<typeof scanProgressSchema>;

/** Filters of `GET /api/scans`. */
export const scanListQuerySchema = z.object({
  page: z.coerce.number().int().min(1, 'page starts at 1').default(1),
  pageSize: z.coerce.number().int().min(1).max(500, 'pageSize is at most 500').default(50),
  status: scanStatusSchema.optional(),
  groupId: z.coerce.number().int().positive().optional(),
  ownerId: z.coerce.number().int().positive().optional(),
  family: z.string().max(64).optional(),
  modelId: z.coerce.number().int().positive().optional(),
  tag: z.string().max(64).optional(),
  createdAfter: z.iso.datetime({ message: 'createdAfter must be an ISO date-time' }).optional(),
  createdBefore: z.iso.datetime({ message: 'createdBefore must be an ISO date-time' }).optional(),
});
export type ScanListQuery = z.infer<typeof scanListQuerySchema>;
