import { z } from 'zod';
import { scanStatusSchema } from './scan-summary.schema.js';

/** Statuses a prune or a retention policy may select: a queued or running scan is never pruned. */
export const PRUNABLE_STATUSES = ['draft', 'completed', 'failed', 'cancelled'] as const;
export const prunableStatusSchema = z.enum(PRUNABLE_STATUSES);
export type PrunableStatus = z.infer<typeof prunableStatusSchema>;

/** Which scans a prune selects; every given condition must hold. */
export const pruneFilterSchema = z.object({
  groupId: z.number().int().positive().optional(),
  /** Only scans older than this many days, counted from `ageBasis`. */
  olderThanDays: z.number().int().min(0).max(36500).optional(),
  /** `finished`: the finish time (the creation time for a scan that never ran); `created`: the creation time. */
  ageBasis: z.enum(['finished', 'created']).default('finished'),
  statuses: z.array(prunableStatusSchema).min(1, 'pick at least one status').default(['completed', 'failed', 'cancelled']),
  ownerId: z.number().int().positive().optional(),
  tag: z.string().trim().min(1).max(64).optional(),
});
export type PruneFilter = z.infer<typeof pruneFilterSchema>;

/** The real prune: the same filter plus exactly the scan ids its dry run listed. */
export const pruneRequestSchema = pruneFilterSchema.extend({
  scanIds: z.array(z.number().int().positive()).max(10_000),
});
export type PruneRequest = z.infer<typeof pruneRequestSchema>;

export const prunePlanItemSchema = z.object({
  scanId: z.number().int(),
  name: z.string(),
  groupId: z.number().int(),
  groupName: z.string(),
  ownerId: z.number().int(),
  ownerName: z.string(),
  status: scanStatusSchema,
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
  points: z.number().int(),
  /** The scan's share of its tables' bytes: its rows times the table's bytes per row. */
  bytes: z.number().int(),
});
export type PrunePlanItem = z.infer<typeof prunePlanItemSchema>;

export const prunePlanSchema = z.object({
  items: z.array(prunePlanItemSchema),
  totalPoints: z.number().int(),
  totalBytes: z.number().int(),
});
export type PrunePlan = z.infer<typeof prunePlanSchema>;

export const pruneResultSchema = z.object({
  deleted: z.array(z.object({ scanId: z.number().int(), archiveId: z.number().int(), points: z.number().int() })),
});
export type PruneResult = z.infer<typeof pruneResultSchema>;

export const tableStorageSchema = z.object({
  table: z.string(),
  /** InnoDB's estimate (information_schema.TABLES.TABLE_ROWS). */
  rows: z.number().int(),
  dataBytes: z.number().int(),
  indexBytes: z.number().int(),
});
export type TableStorage = z.infer<typeof tableStorageSchema>;

export const groupStorageSchema = z.object({
  groupId: z.number().int(),
  groupName: z.string(),
  scans: z.number().int(),
  points: z.number().int(),
  bytes: z.number().int(),
  archives: z.number().int(),
  archiveBytes: z.number().int(),
});
export type GroupStorage = z.infer<typeof groupStorageSchema>;

export const scanStorageSchema = z.object({
  scanId: z.number().int(),
  name: z.string(),
  groupId: z.number().int(),
  status: scanStatusSchema,
  points: z.number().int(),
  bytes: z.number().int(),
});
export type ScanStorage = z.infer<typeof scanStorageSchema>;

export const storageReportSchema = z.object({
  tables: z.array(tableStorageSchema),
  /** Bytes (data + indexes) per stored point in scan_points, from the table's own figures. */
  bytesPerPoint: z.number(),
  groups: z.array(groupStorageSchema),
  /** Largest first. */
  scans: z.array(scanStorageSchema),
  retention: z.object({ cron: z.string(), nextRunAt: z.string().nullable() }),
});
export type StorageReport = z.infer<typeof storageReportSchema>;

export const scanArchiveSchema = z.object({
  id: z.number().int(),
  scanId: z.number().int(),
  scanName: z.string(),
  groupId: z.number().int(),
  fileName: z.string(),
  bytes: z.number().int(),
  sha256: z.string(),
  points: z.number().int(),
  createdById: z.number().int().nullable(),
  createdByName: z.string().nullable(),
  createdAt: z.string(),
});
export type ScanArchive = z.infer<typeof scanArchiveSchema>;

export const archiveListQuerySchema = z.object({
  groupId: z.coerce.number().int().positive().optional(),
});
export type ArchiveListQuery = z.infer<typeof archiveListQuerySchema>;

/** A group's retention: finished scans with these statuses go after `keepDays` days; null days: keep for ever. */
export const retentionPolicySchema = z.object({
  keepDays: z
    .number({ error: 'give the number of days to keep scans' })
    .int('keep scans for whole days')
    .min(1, 'keep scans for at least 1 day')
    .max(36500, 'keep scans for at most 36,500 days')
    .nullable(),
  statuses: z.array(prunableStatusSchema).min(1, 'pick at least one status'),
});
export type RetentionPolicy = z.infer<typeof retentionPolicySchema>;

export const retentionRunSchema = z.object({
  groups: z.array(z.object({ groupId: z.number().int(), deleted: z.number().int() })),
});
export type RetentionRun = z.infer<typeof retentionRunSchema>;
