/** V(φ) and its first three derivatives, in reduced Planck units (M_pl = 1). */
export interface PotentialFunctions {
  V(phi: number): number;
  dV(phi: number): number;
  d2V(phi: number): number;
  d3V(phi: number): number;
}

/** Why a point produced no observables; each comes with a plain-language message. */
export const FAILURE_CODES = [
  'invalid_input',
  'invalid_potential',
  'negative_potential',
  'no_inflation_at_start',
  'insufficient_efolds',
  'no_end',
  'trapped',
  'integration_failed',
  'budget_exceeded',
  'pivot_too_early',
  'slow_roll_invalid',
  'spectrum_feature',
  'chunk_failed',
] as const;
export type FailureCode = (typeof FAILURE_CODES)[number];

export interface Failure {
  status: FailureCode;
  message: string;
  /** Set when known: e-folds available before the failure, field value where it happened. */
  nTotal?: number;
  phi?: number;
  /** For a point refused on its validity (e.g. `spectrum_feature`): the numbers that were computed and are not to be trusted as a tilt. */
  observables?: { ns: number; r: number; alphaS: number; As: number };
}

export function failure(status: FailureCode, message: string, extra: Omit<Failure, 'status' | 'message'> = {}): Failure {
  return { status, message, ...extra };
}

/** Short form of a number for messages. */
export function fmt(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  const a = Math.abs(x);
  return a !== 0 && (a < 1e-3 || a >= 1e5) ? x.toExponential(3) : String(Number(x.toPrecision(6)));
}
