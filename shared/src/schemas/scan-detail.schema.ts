import { z } from 'zod';
import { storedScanSpecSchema } from './scan.schema.js';
import { scanProgressSchema, scanSummarySchema } from './scan-summary.schema.js';

/** One scan with its specification and progress (`GET /api/scans/:id`). */
export const scanDetailSchema = scanSummarySchema.extend({
  note: z.string(),
  spec: storedScanSpecSchema,
  startedAt: z.string().nullable(),
  progress: scanProgressSchema,
});
export type ScanDetail = z.infer<typeof scanDetailSchema>;
