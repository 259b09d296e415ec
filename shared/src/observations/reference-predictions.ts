// Closed-form predictions drawn as reference curves on the n_s–r plane.

/**
 * First-order slow-roll predictions of V ∝ φ^p at N e-folds, for reference curves on the n_s–r
 * plane: n_s = 1 − 2(p+2)/(4N+p), r = 16p/(4N+p) (Liddle & Lyth 2000, from ε_V and η_V of φ^p).
 */
export function monomialPrediction(p: number, nStar: number): { ns: number; r: number } {
  return { ns: 1 - (2 * (p + 2)) / (4 * nStar + p), r: (16 * p) / (4 * nStar + p) };
}

/**
 * Leading-order plateau (Starobinsky / α-attractor) predictions: n_s = 1 − 2/N, r = 12α/N²
 * (Kallosh, Linde & Roest 2013, arXiv:1311.0472).
 */
export function attractorPrediction(alpha: number, nStar: number): { ns: number; r: number } {
  return { ns: 1 - 2 / nStar, r: (12 * alpha) / (nStar * nStar) };
}
