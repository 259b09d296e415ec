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

/** The most uploaded contours one region likelihood combines. */
export const MAX_LIKELIHOOD_REGIONS = 8;
const REGIONS_PREFIX = 'regions:';
const SET_REF = /^([a-z0-9]+(?:-[a-z0-9]+)*)(?:@(\d+))?$/;

/** A likelihood named in a query: a set (`key`, `key@version`, the latest without) or a group's uploaded contours (`regions:<id>,<id>`). */
export type LikelihoodRef = { kind: 'set'; key: string; version: number | undefined } | { kind: 'regions'; ids: number[] };

/**
 * The one reading of `likelihood=` on every route: a likelihood set as `key` or `key@version`, or
 * uploaded constraint regions as `regions:<id>,<id>` (nested contours of distinct levels, judged by
 * `RegionLikelihood`).
 */
export const likelihoodRefSchema = z
  .string({ error: 'name the likelihood set, e.g. likelihood=planck18-bk18' })
  .transform((value, ctx): LikelihoodRef => {
    if (value.startsWith(REGIONS_PREFIX)) {
      const ids = value.slice(REGIONS_PREFIX.length).split(',');
      const fail = (message: string) => {
        ctx.addIssue({ code: 'custom', message });
        return z.NEVER;
      };
      if (!ids.every((id) => /^[1-9]\d{0,9}$/.test(id))) return fail('name uploaded regions by their ids, e.g. regions:12,13');
      if (ids.length > MAX_LIKELIHOOD_REGIONS) return fail(`a region likelihood combines at most ${MAX_LIKELIHOOD_REGIONS} regions`);
      if (new Set(ids).size !== ids.length) return fail('name each region once');
      return { kind: 'regions', ids: ids.map(Number) };
    }
    const match = SET_REF.exec(value);
    if (!match) {
      ctx.addIssue({ code: 'custom', message: 'name a likelihood set as key or key@version, e.g. planck18-bk18 or planck18-bk18@1' });
      return z.NEVER;
    }
    return { kind: 'set', key: match[1], version: match[2] === undefined ? undefined : Number(match[2]) };
  })
  .describe('A likelihood set as `key` or `key@version` (see /api/likelihood-sets), or uploaded constraint regions as `regions:<id>,<id>` (nested contours of distinct levels)');

/** The reference that names a likelihood in a query, e.g. `planck18-bk18@1` or `regions:12,13`. */
export function likelihoodRefText(ref: LikelihoodRef): string {
  if (ref.kind === 'regions') return `${REGIONS_PREFIX}${ref.ids.join(',')}`;
  return ref.version === undefined ? ref.key : `${ref.key}@${ref.version}`;
}

/** One uploaded contour a region likelihood was built from. */
export const likelihoodRegionSchema = z.object({ id: z.number().int(), name: z.string(), source: z.string(), confidenceLevel: z.number() });

/**
 * The likelihood an answer was judged with: a set (its version and sources), or uploaded regions
 * (their names, levels and sources). `ref` names it again in a query; `statement` is shown wherever it is used.
 */
export const judgedLikelihoodSchema = z.discriminatedUnion('kind', [
  likelihoodSetEntrySchema.extend({ kind: z.literal('set'), ref: z.string() }),
  z.object({
    kind: z.literal('regions'),
    ref: z.string(),
    name: z.string(),
    statement: z.string(),
    regions: z.array(likelihoodRegionSchema),
  }),
]);
export type JudgedLikelihood = z.infer<typeof judgedLikelihoodSchema>;
