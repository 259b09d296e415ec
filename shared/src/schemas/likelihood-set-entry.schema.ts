import { z } from 'zod';
import { likelihoodSetSchema } from './likelihood-set.schema.js';

/** A likelihood set as the API lists it: built into this version of Sixtyfold, or added by an admin (when). */
export const likelihoodSetEntrySchema = likelihoodSetSchema.extend({
  builtIn: z.boolean(),
  addedAt: z.string().nullable(),
});
export type LikelihoodSetEntry = z.infer<typeof likelihoodSetEntrySchema>;

/** What an admin sends to add a set, or a new version of a set added before: the version is the next one. */
export const likelihoodSetInputSchema = likelihoodSetSchema.omit({ version: true });
export type LikelihoodSetInput = z.infer<typeof likelihoodSetInputSchema>;

/** `GET /api/likelihood-sets/:key?version=`: the latest version unless one is asked. */
export const likelihoodSetQuerySchema = z.object({
  version: z.coerce.number({ error: 'must be a number' }).int('must be a whole number').min(1, 'versions start at 1').optional(),
});
