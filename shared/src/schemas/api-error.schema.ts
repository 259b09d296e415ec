import { z } from 'zod';

/** Shape of every error body the API sends: a sentence for people, per-field details for forms. */
export const apiErrorSchema = z.object({
  statusCode: z.number().int(),
  error: z.string(),
  message: z.string(),
  fieldErrors: z.record(z.string(), z.array(z.string())).optional(),
  /** For a refused upload: the 1-based line of the file the message is about. */
  line: z.number().int().optional(),
});
export type ApiError = z.infer<typeof apiErrorSchema>;
