import { z } from 'zod';
import { scanMethodSchema } from './scan-summary.schema.js';

/** A reheating history for N_* (see engine/pivot/reheating.ts). */
export const reheatingSchema = z
  .object({
    w: z.number().gt(-1 / 3, 'w_reh must be above −1/3').lte(1, 'w_reh is at most 1'),
    energyGeV: z.number().positive('the reheating energy scale must be positive').optional(),
    temperatureGeV: z.number().positive('the reheating temperature must be positive').optional(),
    dof: z.number().positive().optional(),
  })
  .refine((r) => (r.energyGeV === undefined) !== (r.temperatureGeV === undefined), {
    message: 'give energyGeV (ρ_reh^1/4) or temperatureGeV, exactly one of them',
  });

/**
 * One point to evaluate: a built-in family (by key) or an expression in `phi` and the
 * parameters, with N_* fixed or from reheating. `npm run evaluate` reads these.
 */
export const evaluateRequestSchema = z
  .object({
    potential: z.string().min(1, 'potential is empty').max(2000, 'potential is longer than 2000 characters'),
    params: z.record(z.string(), z.number({ error: 'parameter values must be finite numbers' })).default({}),
    phiInit: z.number().optional(),
    nStar: z.number().gt(0, 'N_* must be positive').lte(1000, 'N_* is at most 1000').optional(),
    reheating: reheatingSchema.optional(),
    method: scanMethodSchema.default('slowroll'),
    tolerance: z.number().min(1e-14).max(1e-4).optional(),
    trajectory: z.boolean().optional(),
    spectrum: z.boolean().optional(),
  })
  .refine((r) => (r.nStar === undefined) !== (r.reheating === undefined), {
    message: 'give nStar or reheating, exactly one of them',
    path: ['nStar'],
  });
export type EvaluateRequest = z.input<typeof evaluateRequestSchema>;
