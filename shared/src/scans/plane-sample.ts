/** Which points of a scan an n_s–r plane reads when it may show at most `limit` of them. */
export interface PlaneSample {
  /** The step along each axis (a point list is one axis, its point order): every stride-th value is kept. */
  axisStrides: number[];
  /** The kept point indices, ascending; at most `limit` of them. */
  pointIndices: number[];
}

/**
 * An even sample of a grid with axes of `lengths` values (last axis fastest, as point indices
 * count): a sub-grid that keeps every s_a-th value of axis a from the first, with the largest
 * steps made coarser one at a time until at most `limit` points remain. A stride over point
 * indices alone would keep only some values of the inner axis whenever it divides their count.
 */
export function planeSample(lengths: readonly number[], limit: number): PlaneSample {
  const strides = lengths.map(() => 1);
  const kept = (a: number) => Math.ceil(lengths[a] / strides[a]);
  const count = () => lengths.reduce((n, _, a) => n * kept(a), 1);
  while (count() > limit) {
    // The axis with the most kept values gets a coarser step, to the next step that keeps fewer.
    let widest = 0;
    for (let a = 1; a < lengths.length; a++) if (kept(a) > kept(widest)) widest = a;
    const fewer = kept(widest) - 1;
    strides[widest] = Math.ceil(lengths[widest] / fewer);
    while (kept(widest) > fewer) strides[widest]++;
  }
  const pointIndices: number[] = [];
  const visit = (a: number, base: number) => {
    if (a === lengths.length) {
      pointIndices.push(base);
      return;
    }
    for (let i = 0; i < lengths[a]; i += strides[a]) visit(a + 1, base * lengths[a] + i);
  };
  if (lengths.length) visit(0, 0);
  return { axisStrides: strides, pointIndices };
}
