import { evaluateRequestSchema, type EvaluateRequest } from '../schemas/evaluate.schema.js';
import { parsePotential, type ParsedPotential } from './expression/index.js';
import type { EngineOptions } from './budget.js';
import { PointEvaluator, type PointOutcome, type PointResult } from './evaluate-point.js';
import { findFamily, START_EFOLDS, type PotentialFamily } from './families/potential-families.js';
import { failure, fmt, type Failure } from './types.js';

/** One evaluated point as scripts and the API see it: outputs are null when status is not ok. */
export interface EvaluateResponse {
  status: PointOutcome['status'];
  message: string;
  ns: number | null;
  r: number | null;
  alphaS: number | null;
  nt: number | null;
  As: number | null;
  amplitudeScale: number | null;
  nTotal: number | null;
  nStar: number | null;
  phiStar: number | null;
  phiEnd: number | null;
  deltaPhi: number | null;
  energyScaleGeV: number | null;
  hubbleGeV: number | null;
  phiInit: number | null;
  secondOrder: PointResult['secondOrder'] | null;
  evaluations: number | null;
  trajectory?: PointResult['trajectory'];
  spectrum?: PointResult['spectrum'];
}

/** Outcomes after which a family's start is moved further up (doubling its slow-roll e-folds, up to the largest N_*). */
const MOVE_START_ON = new Set<string>(['insufficient_efolds', 'pivot_too_early']);
const MAX_START_EFOLDS = 1200;

const NULL_OUTPUTS = {
  ns: null, r: null, alphaS: null, nt: null, As: null, amplitudeScale: null, nStar: null, phiStar: null,
  phiEnd: null, deltaPhi: null, energyScaleGeV: null, hubbleGeV: null, secondOrder: null, evaluations: null,
};

/**
 * Parses, differentiates and evaluates requests, keeping the parsed expressions of recent
 * potentials so that a scan parses its expression once. Pure apart from that cache.
 */
export class RequestEvaluator {
  private readonly parsed = new Map<string, ParsedPotential | Failure>();
  private readonly bound = new Map<string, ReturnType<ParsedPotential['bind']>>();
  /** Default starts of families by the parameters they depend on: a scan over N_* or a scale finds one once. */
  private readonly starts = new Map<string, number>();
  private readonly point: PointEvaluator;

  /** `engine`: per-point budgets and the clock for the wall-time budget (the worker and the browser pass `performance.now`). */
  constructor(engine: EngineOptions = {}) {
    this.point = new PointEvaluator({}, engine);
  }

  evaluate(input: unknown): EvaluateResponse {
    const request = evaluateRequestSchema.safeParse(input);
    if (!request.success) {
      const message = request.error.issues.map((i) => (i.path.length ? `${i.path.join('.')}: ${i.message}` : i.message)).join('; ');
      return respond(failure('invalid_input', message), null);
    }
    const req = request.data;
    const family = findFamily(req.potential);
    const source = family ? family.expression : req.potential;
    const params = family ? { ...Object.fromEntries(family.parameters.map((p) => [p.name, p.defaultValue])), ...req.params } : req.params;
    const parsed = this.parse(source, Object.keys(params));
    if ('status' in parsed) return respond(parsed, null);
    // The overall scale: computed at the reference value and scaled after, so that points differing
    // only in it share one background and are the same numbers as each computed alone.
    const scale = family ? family.scale : parsed.scale;
    if (scale) {
      const value = params[scale.parameter];
      // A family's reference is its default; an expression's is 1, because the request alone must
      // fix it (defaults live in the model, not the request) so that every point of a scan agrees.
      const reference = family ? family.parameters.find((q) => q.name === scale.parameter)!.defaultValue : 1;
      if (value > 0 && Number.isFinite(value) && value !== reference) {
        const response = this.evaluate({ ...req, params: { ...req.params, [scale.parameter]: reference } });
        // A potential refused at its start quotes V there: that answer comes from the point as
        // given (nothing was integrated), so the number is the user's V, not the reference's.
        if (!refusedAtStart(response)) return rescaled(response, (value / reference) ** scale.power);
      }
    }
    const bound = this.bind(source, parsed, params);
    if (!bound.ok) return respond(failure('invalid_input', bound.problem.message), null);
    const potential = bound.potential;
    if (req.phiInit === undefined && !family) {
      return respond(failure('invalid_input', 'phiInit is required for an expression (built-in families know where they inflate)'), null);
    }
    const evaluateFrom = (phiInit: number) => this.point.evaluate({
      potential,
      phiInit,
      method: req.method,
      nStar: req.nStar,
      reheating: req.reheating,
      tolerance: req.tolerance,
      trajectory: req.trajectory,
      spectrum: req.spectrum,
    });
    if (req.phiInit !== undefined || !family) return respond(evaluateFrom(req.phiInit as number), req.phiInit ?? null);
    // A family's start moves up the potential by itself while the point lacks history before the pivot.
    let efolds = START_EFOLDS;
    for (;;) {
      const phiInit = this.defaultStart(family, params, parsed, efolds);
      if (phiInit === undefined) return respond(failure('invalid_input', `no start for ${family.key} with these parameters`), null);
      const slope = potential.dV(phiInit) / potential.V(phiInit);
      if (Math.abs(slope) < 1e-14) {
        // The engine takes such a start as resting on the top (see BackgroundSolver.solve): say why the family put it there.
        const eta = Math.abs(potential.d2V(phiInit) / potential.V(phiInit));
        return respond(failure('insufficient_efolds', `with these parameters ${family.name} has no start that gives ${efolds} e-folds: a hilltop this sharp (|η_V| = ${fmt(eta)} at the top) needs the field at φ = ${fmt(phiInit)}, where V'/V = ${fmt(slope)} is below the 1e-14 the engine resolves`), phiInit);
      }
      const outcome = evaluateFrom(phiInit);
      if (!MOVE_START_ON.has(outcome.status) || efolds >= MAX_START_EFOLDS) return respond(outcome, phiInit);
      efolds *= 2;
    }
  }

  /**
   * The family's start for these parameters. It is computed with every parameter it does not
   * depend on at its default, so the same start comes out to the last bit whichever point of a
   * scan asked first, and one computation serves a whole scan over N_* or the overall scale.
   */
  private defaultStart(family: PotentialFamily, params: Record<string, number>, parsed: ParsedPotential, efolds: number): number | undefined {
    const key = `${family.key}|${efolds}|${family.startDependsOn.map((name) => params[name]).join(',')}`;
    let start = this.starts.get(key);
    if (start === undefined) {
      const startParams = Object.fromEntries(family.parameters.map((p) => [p.name, p.defaultValue]));
      for (const name of family.startDependsOn) startParams[name] = params[name];
      const bound = parsed.bind(startParams);
      if (!bound.ok) return undefined;
      start = family.phiInit(startParams, bound.potential, efolds);
      remember(this.starts, key, start);
    }
    return start;
  }

  /**
   * The bound potential for these parameters, the same object for the same values: points that
   * differ only in N_* or the reheating history then share one background (`PointEvaluator`).
   */
  private bind(source: string, parsed: ParsedPotential, params: Record<string, number>): ReturnType<ParsedPotential['bind']> {
    const key = `${source}|${Object.keys(params).sort().map((name) => `${name}=${params[name]}`).join(',')}`;
    let bound = this.bound.get(key);
    if (!bound) {
      bound = parsed.bind(params);
      remember(this.bound, key, bound, 16);
    }
    return bound;
  }

  private parse(source: string, names: string[]): ParsedPotential | Failure {
    const key = `${names.join(',')}|${source}`;
    let entry = this.parsed.get(key);
    if (!entry) {
      const result = parsePotential(source, names);
      entry = result.ok ? result.potential : failure('invalid_potential', result.problem.message);
      remember(this.parsed, key, entry);
    }
    return entry;
  }
}

/** Bounded cache: the oldest entry goes first. */
function remember<V>(cache: Map<string, V>, key: string, value: V, limit = 256): void {
  if (cache.size >= limit) cache.delete(cache.keys().next().value as string);
  cache.set(key, value);
}

/** V itself refused at φ_init (not finite, or not positive), before any integration. */
function refusedAtStart(response: EvaluateResponse): boolean {
  return (response.status === 'negative_potential' || response.status === 'invalid_potential') && response.nTotal === null;
}

/** An answer computed at the reference scale, for V multiplied by `factor`: only the amplitudes change. */
function rescaled(response: EvaluateResponse, factor: number): EvaluateResponse {
  if (response.status !== 'ok') return response;
  const scaled: EvaluateResponse = {
    ...response,
    As: response.As! * factor,
    amplitudeScale: response.amplitudeScale! / factor,
    secondOrder: response.secondOrder && { ...response.secondOrder, As: response.secondOrder.As * factor },
  };
  if (response.spectrum) {
    scaled.spectrum = { ...response.spectrum, scalar: response.spectrum.scalar.map((x) => x * factor), tensor: response.spectrum.tensor.map((x) => x * factor) };
  }
  return scaled;
}

function respond(outcome: PointOutcome, phiInit: number | null): EvaluateResponse {
  if (outcome.status !== 'ok') {
    return { status: outcome.status, message: outcome.message, ...NULL_OUTPUTS, nTotal: outcome.nTotal ?? null, phiInit };
  }
  const { status, message, ns, r, alphaS, nt, As, amplitudeScale, nTotal, nStar, phiStar, phiEnd, deltaPhi, energyScaleGeV, hubbleGeV, secondOrder, evaluations } = outcome;
  const response: EvaluateResponse = {
    status, message, ns, r, alphaS, nt, As, amplitudeScale, nTotal, nStar, phiStar, phiEnd, deltaPhi, energyScaleGeV, hubbleGeV, phiInit, secondOrder, evaluations,
  };
  if (outcome.trajectory) response.trajectory = outcome.trajectory;
  if (outcome.spectrum) response.spectrum = outcome.spectrum;
  return response;
}

export type { EvaluateRequest };
