import type { FailureCode, PointOutput } from '@sixtyfold/shared';

/** How each stored output is named on screen: symbol first, as the field writes it. */
export const OUTPUT_LABELS: Record<PointOutput, string> = {
  ns: 'n_s',
  r: 'r',
  alphaS: 'α_s',
  As: 'A_s (as given)',
  amplitudeScale: 'A_s normalisation',
  nTotal: 'N_total',
  nStar: 'N_*',
  phiStar: 'φ_*',
  phiEnd: 'φ_end',
  energyScaleGeV: 'V_*^¼ (GeV)',
};

/** Axis parameters that are not potential parameters, by their on-screen names. */
const PIVOT_LABELS: Record<string, string> = {
  nStar: 'N_*',
  reheatingW: 'w_reh',
  reheatingEnergyGeV: 'ρ_reh^¼ (GeV)',
};

export const inputLabel = (parameter: string) => PIVOT_LABELS[parameter] ?? parameter;

/** Why a point has no observables, in a few words (the stored reason says the rest). */
export const FAILURE_LABELS: Record<FailureCode, string> = {
  invalid_input: 'invalid input',
  invalid_potential: 'potential cannot be evaluated',
  negative_potential: 'V(φ) < 0',
  no_inflation_at_start: 'not inflating at φ_init',
  insufficient_efolds: 'too few e-folds',
  no_end: 'inflation does not end',
  trapped: 'field trapped',
  integration_failed: 'integration failed',
  budget_exceeded: 'over the point budget',
  pivot_too_early: 'pivot too near the start',
  slow_roll_invalid: 'slow roll not valid',
  spectrum_feature: 'not a power law at the pivot',
  chunk_failed: 'workers could not compute',
};

export const failureLabel = (status: string) => FAILURE_LABELS[status as FailureCode] ?? status;

/** Axis parameters as choices of a select, by their on-screen names. */
export const axisOptions = (parameters: string[]) => parameters.map((parameter) => ({ value: parameter, label: inputLabel(parameter) }));
