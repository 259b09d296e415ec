import { z } from 'zod';
import { likelihoodRefSchema } from './likelihood-set-entry.schema.js';

/** `GET /api/scans/:id/citation`: with `likelihood=` the picked likelihood's sources are cited too; `format=bib` downloads the .bib file. */
export const scanCitationQuerySchema = z.object({
  likelihood: likelihoodRefSchema.optional(),
  format: z.enum(['json', 'bib'], { error: 'format must be json or bib' }).default('json'),
});
export type ScanCitationQuery = z.infer<typeof scanCitationQuerySchema>;

export const scanCitationSchema = z.object({
  scanId: z.number().int(),
  /** The entries' keys, in the file's order. */
  keys: z.array(z.string()),
  bibtex: z.string(),
});
export type ScanCitation = z.infer<typeof scanCitationSchema>;
