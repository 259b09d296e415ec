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

/** A likelihood set named in a query: `key`, or `key@version` (the latest without), read as { key, version }. */
export const likelihoodRefSchema = z
  .string({ error: 'name the likelihood set, e.g. likelihood=planck18-bk18' })
  .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*(?:@\d+)?$/, 'name a likelihood set as key or key@version, e.g. planck18-bk18 or planck18-bk18@1')
  .transform((value) => {
    const [key, version] = value.split('@');
    return { key, version: version === undefined ? undefined : Number(version) };
  });
export type LikelihoodRef = z.output<typeof likelihoodRefSchema>;
