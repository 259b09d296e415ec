import { axisCells, gridSize, isJudged, type AxisCells, type GridLikelihood } from './grid-axes.js';

/** Shown beside every evidence and Bayes factor. */
export const EVIDENCE_PRIOR_NOTE =
  'The evidence is the mean likelihood over the prior volume the scan chose (its axes and their priors): ' +
  'widening an axis that the likelihood does not fill lowers it, so ln B compares models together with their prior ranges.';

export interface GridEvidence {
  /** Z = Σ L·w / Σ w over the judged points: the mean of L = exp(−Δχ²/2) over the prior volume. */
  z: number;
  lnZ: number;
  /** ln Z from the same grid at half resolution (every second value per axis, ends kept). */
  lnZHalf: number;
  /** |ln Z − ln Z_half|: a conservative estimate of the numerical error of ln Z. */
  lnZError: number;
  included: number;
  excluded: number;
}

/** The evidence of a grid scan under one likelihood, with its numerical error. */
export function gridEvidence(input: GridLikelihood): GridEvidence {
  const size = gridSize(input);
  const full = input.axes.map((axis) => axisCells(axis));
  const half = input.axes.map((axis, a) => axisCells(axis, everySecond(full[a])));
  const fullSum = weightedMean(input, full);
  const halfSum = weightedMean(input, half);
  return {
    z: Math.exp(fullSum.lnMean),
    lnZ: fullSum.lnMean,
    lnZHalf: halfSum.lnMean,
    lnZError: Math.abs(fullSum.lnMean - halfSum.lnMean),
    included: fullSum.included,
    excluded: size - fullSum.included,
  };
}

/** Every second value of an axis by value (positions), always keeping both ends so the prior range stays. */
function everySecond(cells: AxisCells): number[] {
  const n = cells.order.length;
  const kept = [...cells.order].filter((_, k) => k % 2 === 0);
  if (n > 1 && (n - 1) % 2 !== 0) kept.push(cells.order[n - 1]);
  return kept;
}

/** ln(Σ L·w / Σ w) over the judged points with nonzero weight, scaled by the best L so nothing underflows. */
function weightedMean(input: GridLikelihood, cells: AxisCells[]): { lnMean: number; included: number } {
  const chi2 = input.deltaChi2;
  const lengths = input.axes.map((axis) => axis.values.length);
  const dims = lengths.length;
  const strides = new Array<number>(dims);
  for (let a = dims - 1, s = 1; a >= 0; s *= lengths[a], a--) strides[a] = s;
  const kept = cells.map((c) => c.order);
  const visit = (each: (d: number, w: number) => void) => {
    const k = new Int32Array(dims);
    for (;;) {
      let p = 0;
      let w = 1;
      for (let a = 0; a < dims; a++) {
        const i = kept[a][k[a]];
        p += i * strides[a];
        w *= cells[a].widths[i];
      }
      const d = chi2[p];
      if (isJudged(d)) each(d, w);
      let a = dims - 1;
      for (; a >= 0; a--) {
        if (++k[a] < kept[a].length) break;
        k[a] = 0;
      }
      if (a < 0) return;
    }
  };
  let least = Infinity;
  let included = 0;
  visit((d) => {
    included++;
    if (d < least) least = d;
  });
  if (included === 0) throw new RangeError('no point of the scan has a Δχ²: every point failed or was flagged');
  let likelihoodSum = 0;
  let weightSum = 0;
  visit((d, w) => {
    likelihoodSum += least === Infinity ? 0 : Math.exp(-(d - least) / 2) * w;
    weightSum += w;
  });
  return { lnMean: -least / 2 + Math.log(likelihoodSum / weightSum), included };
}

/** Kass & Raftery (1995), "Bayes Factors", JASA 90, 773: their scale on 2 ln B (from memory). */
export type EvidenceStrength = 'not worth more than a bare mention' | 'positive' | 'strong' | 'very strong';

export function evidenceStrength(twoLnB: number): EvidenceStrength {
  const size = Math.abs(twoLnB);
  if (size < 2) return 'not worth more than a bare mention';
  if (size < 6) return 'positive';
  if (size < 10) return 'strong';
  return 'very strong';
}

export interface BayesFactor {
  /** ln B = ln Z_model − ln Z_reference. */
  lnB: number;
  twoLnB: number;
  favoured: 'model' | 'reference' | 'neither';
  strength: EvidenceStrength;
  /** The verdict in words, e.g. "positive evidence for the model over the reference". */
  words: string;
}

/** Compares a model's evidence with a reference's (same likelihood set), both ways. */
export function bayesFactor(lnZModel: number, lnZReference: number): BayesFactor {
  const lnB = lnZModel - lnZReference;
  const strength = evidenceStrength(2 * lnB);
  const favoured = lnB > 0 ? 'model' : lnB < 0 ? 'reference' : 'neither';
  const words =
    favoured === 'neither'
      ? 'no preference between the model and the reference'
      : `${strength === 'not worth more than a bare mention' ? 'evidence not worth more than a bare mention' : `${strength} evidence`} for the ${favoured} over the ${favoured === 'model' ? 'reference' : 'model'}`;
  return { lnB, twoLnB: 2 * lnB, favoured, strength, words };
}
