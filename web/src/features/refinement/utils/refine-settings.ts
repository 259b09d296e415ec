import { POINT_OUTPUTS, refineScanSchema, type PointOutput, type RefineScanInput } from '@sixtyfold/shared';

/** The refine form as typed: strings, so a half-typed number stays on screen. */
export interface RefineSettings {
  kind: 'likelihood' | 'output';
  likelihood: string;
  level: '68' | '95';
  output: PointOutput;
  value: string;
  /** Factor per axis parameter, '1' to '4'. */
  factors: Record<string, string>;
  depth: string;
}

export function defaultRefineSettings(axes: readonly string[]): RefineSettings {
  return { kind: 'likelihood', likelihood: 'planck18-bk18', level: '95', output: 'ns', value: '0.965', factors: Object.fromEntries(axes.map((a) => [a, '2'])), depth: '3' };
}

/** The request body, or the schema's first problem (the same schema the API validates with). */
export function refineRequest(settings: RefineSettings): { body: RefineScanInput; problem: null } | { body: null; problem: string } {
  const body = {
    boundary:
      settings.kind === 'likelihood'
        ? { kind: 'likelihood' as const, likelihood: settings.likelihood.trim(), level: Number(settings.level) as 68 | 95 }
        : { kind: 'output' as const, output: settings.output, value: settings.value.trim() === '' ? Number.NaN : Number(settings.value) },
    factors: Object.fromEntries(Object.entries(settings.factors).map(([axis, f]) => [axis, Number(f)])),
    depth: Number(settings.depth),
  };
  const parsed = refineScanSchema.safeParse(body);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    return { body: null, problem: `${issue.path.join('.')}: ${issue.message}` };
  }
  return { body, problem: null };
}

/** The estimate's query string for a valid request (the boundary flattened, `factor.<axis>`). */
export function estimateQuery(body: RefineScanInput): Record<string, string | number> {
  const boundary: Record<string, string | number> = body.boundary.kind === 'likelihood'
    ? { boundary: 'likelihood', likelihood: body.boundary.likelihood, level: body.boundary.level }
    : { boundary: 'output', output: body.boundary.output, value: body.boundary.value };
  const factors = Object.fromEntries(Object.entries(body.factors ?? {}).map(([axis, f]) => [`factor.${axis}`, f]));
  return { ...boundary, ...factors, depth: body.depth ?? 2 };
}

export const REFINE_OUTPUTS = POINT_OUTPUTS;
