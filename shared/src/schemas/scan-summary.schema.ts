import { z } from 'zod';

export const SCAN_STATUSES = ['draft', 'queued', 'running', 'completed', 'failed', 'cancelled'] as const;
export const scanStatusSchema = z.enum(SCAN_STATUSES);
export type ScanStatus = z.infer<typeof scanStatusSchema>;

export const SCAN_METHODS = ['slowroll', 'exact'] as const;
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
