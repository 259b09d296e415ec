import { z } from 'zod';
import { scanMethodSchema } from './scan-summary.schema.js';
import { scanRefinementSchema } from './refinement.schema.js';

/** What an axis may vary besides a model parameter. */
export const PIVOT_AXES = ['nStar', 'reheatingW', 'reheatingEnergyGeV'] as const;
export type PivotAxis = (typeof PIVOT_AXES)[number];

/** Largest scan any group may submit unless the site sets a lower limit. */
export const DEFAULT_POINT_LIMIT = 1_000_000;

const finite = (what: string) => z.number({ error: `${what} must be a finite number` });

const axisName = z.string().min(1, 'choose what the axis varies').max(64);

export const rangeAxisSchema = z.object({
  kind: z.literal('range'),
  parameter: axisName,
  min: finite('min'),
  max: finite('max'),
  count: z.number().int('count must be a whole number').min(1, 'an axis has at least 1 value').max(100_000, 'an axis has at most 100,000 values'),
  spacing: z.enum(['linear', 'log']).default('linear'),
});

export const listAxisSchema = z.object({
  kind: z.literal('list'),
  parameter: axisName,
  values: z.array(finite('every value')).min(1, 'the list is empty').max(100_000, 'a list has at most 100,000 values'),
});

export const scanAxisSchema = z.discriminatedUnion('kind', [rangeAxisSchema, listAxisSchema]);
export type ScanAxis = z.infer<typeof scanAxisSchema>;

/**
 * At most this many points in a list. The list is part of the stored spec, which every chunk job
 * and every read of the scan carries (0.6 MB of JSON for 50,000 points of two columns); a grid of a million
 * points is a few numbers, a list of a million would be tens of megabytes in each.
 */
export const POINT_LIST_MAX_POINTS = 50_000;

/**
 * Points given one by one instead of a grid: `columns` names what each row sets (model
 * parameters, nStar, reheatingW, reheatingEnergyGeV, as an axis would), row i is point i.
 */
export const pointListSchema = z.object({
  columns: z.array(axisName).min(1, 'a point list needs at least one column').max(64, 'a point list has at most 64 columns'),
  rows: z
    .array(z.array(finite('every value')))
    .min(1, 'the point list has no points')
    .max(POINT_LIST_MAX_POINTS, `a point list has at most ${POINT_LIST_MAX_POINTS.toLocaleString('en-US')} points`),
});
export type PointList = z.infer<typeof pointListSchema>;

export const scanModelSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('family'), family: z.string().min(1) }),
  z.object({ kind: z.literal('group'), modelId: z.number().int().positive() }),
]);
export type ScanModel = z.infer<typeof scanModelSchema>;

export const scanPivotSchema = z.discriminatedUnion('kind', [
  /** N_* fixed, or on an axis named nStar. */
  z.object({ kind: z.literal('fixed'), nStar: finite('N_*').gt(0).lte(1000).optional() }),
  /** N_* from reheating; w and ρ_reh^1/4 fixed here or on axes reheatingW / reheatingEnergyGeV. */
  z.object({
    kind: z.literal('reheating'),
    w: finite('w_reh').gt(-1 / 3, 'w_reh must be above −1/3').lte(1, 'w_reh is at most 1').optional(),
    energyGeV: finite('the reheating energy').positive('the reheating energy must be positive').optional(),
  }),
]);
export type ScanPivot = z.infer<typeof scanPivotSchema>;

/**
 * A scan as submitted: the web form and `POST /api/scans` validate with this one schema.
 * Its points are either a grid of `axes` (run in the order given, the last one fastest, so
 * point i is a fixed set of values) or a `pointList`, exactly one of the two. Stored specs
 * from before point lists all have axes, so `axes` keeps its shape and only became optional.
 */
export const createScanSchema = z
  .object({
    groupId: z.number().int().positive(),
    name: z.string().trim().min(1, 'give the scan a name').max(200, 'names are at most 200 characters'),
    tags: z.array(z.string().trim().min(1).max(64, 'tags are at most 64 characters')).max(20, 'at most 20 tags').default([]),
    note: z.string().max(10_000, 'notes are at most 10,000 characters').default(''),
    model: scanModelSchema,
    /** Values of the model's parameters that no axis varies. */
    params: z.record(z.string(), finite('each parameter value')).default({}),
    phiInit: finite('φ_init').optional(),
    axes: z.array(scanAxisSchema).min(1, 'add at least one axis').max(4, 'a scan has at most 4 axes').optional(),
    pointList: pointListSchema.optional(),
    pivot: scanPivotSchema,
    method: scanMethodSchema,
    tolerance: z.number().min(1e-14).max(1e-4).optional(),
  })
  .superRefine((spec, ctx) => {
    if ((spec.axes === undefined) === (spec.pointList === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['axes'], message: spec.axes ? 'give axes or a point list, not both' : 'add at least one axis' });
    }
    // What the points vary, each with where a problem with it is reported.
    const varied = spec.axes
      ? spec.axes.map((axis, i) => ({ name: axis.parameter, path: ['axes', i, 'parameter'], on: 'on an axis', twice: 'is on two axes' }))
      : (spec.pointList?.columns ?? []).map((name, i) => ({ name, path: ['pointList', 'columns', i], on: 'a column', twice: 'is a column twice' }));
    const seen = new Set<string>();
    for (const { name, path, on, twice } of varied) {
      if (seen.has(name)) ctx.addIssue({ code: 'custom', path, message: `${name} ${twice}` });
      seen.add(name);
      if (name in spec.params) ctx.addIssue({ code: 'custom', path, message: `${name} is both fixed and ${on}` });
      const pivotAxis = (PIVOT_AXES as readonly string[]).includes(name);
      if (name === 'nStar' && spec.pivot.kind !== 'fixed') {
        ctx.addIssue({ code: 'custom', path, message: `an N_* ${on === 'a column' ? 'column' : 'axis'} needs a fixed pivot, not reheating` });
      }
      if (pivotAxis && name !== 'nStar' && spec.pivot.kind !== 'reheating') {
        ctx.addIssue({ code: 'custom', path, message: `${name} needs N_* from reheating` });
      }
    }
    spec.axes?.forEach((axis, i) => {
      if (axis.kind === 'range') {
        if (axis.count > 1 && !(axis.max > axis.min)) {
          ctx.addIssue({ code: 'custom', path: ['axes', i, 'max'], message: 'max must be above min' });
        }
        if (axis.spacing === 'log' && !(axis.min > 0)) {
          ctx.addIssue({ code: 'custom', path: ['axes', i, 'min'], message: 'a logarithmic axis needs min > 0' });
        }
      }
    });
    const list = spec.pointList;
    if (list) {
      const wrong = list.rows.findIndex((row) => row.length !== list.columns.length);
      if (wrong >= 0) {
        ctx.addIssue({ code: 'custom', path: ['pointList', 'rows', wrong], message: `point ${wrong} has ${list.rows[wrong].length} values for ${list.columns.length} columns` });
      }
    }
    const where = spec.axes ? 'on an axis' : 'in a column';
    const p = spec.pivot;
    if (p.kind === 'fixed' && p.nStar === undefined && !seen.has('nStar')) {
      ctx.addIssue({ code: 'custom', path: ['pivot', 'nStar'], message: spec.axes ? 'give N_* or put it on an axis' : 'give N_* or add a column nStar' });
    }
    if (p.kind === 'fixed' && p.nStar !== undefined && seen.has('nStar')) {
      ctx.addIssue({ code: 'custom', path: ['pivot', 'nStar'], message: `N_* is both fixed and ${where}` });
    }
    if (p.kind === 'reheating') {
      for (const [field, axis] of [['w', 'reheatingW'], ['energyGeV', 'reheatingEnergyGeV']] as const) {
        if ((p[field] === undefined) === !seen.has(axis)) {
          ctx.addIssue({ code: 'custom', path: ['pivot', field], message: `give ${axis === 'reheatingW' ? 'w_reh' : 'the reheating energy'} either here or ${where}, once` });
        }
      }
    }
  });
export type CreateScan = z.infer<typeof createScanSchema>;
export type CreateScanInput = z.input<typeof createScanSchema>;

/**
 * A scan specification as stored: the submitted spec completed with defaults, and its potential
 * frozen. The one reading of the `scans.spec` column (the API's column transformer), of the scan
 * detail the web receives, and of the worker's job.
 */
export const storedScanSpecSchema = z.intersection(
  createScanSchema,
  z.object({
    /** Family key or expression, copied at submission so a later model edit changes nothing. */
    potentialSource: z.string().min(1),
    /**
     * Axes along which points share one background (N_*, the reheating history, the parameter that
     * only scales V), decided at submission: they are computed fastest (`computeOrder`).
     */
    sharedBackgroundAxes: z.array(z.string()).optional(),
    /** Set on a refinement level: its chain, and the lattice coordinates of its point list's rows. */
    refinement: scanRefinementSchema.optional(),
  }),
);
export type StoredScanSpec = z.infer<typeof storedScanSpecSchema>;
