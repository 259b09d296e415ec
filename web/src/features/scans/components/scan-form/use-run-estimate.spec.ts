import { sampleIndices } from './use-run-estimate';

describe('sampleIndices', () => {
  it('spreads the timed points over the whole grid, ends included', () => {
    expect(sampleIndices(1_000)).toEqual([0, 200, 400, 599, 799, 999]);
  });

  it('times every point of a grid smaller than the sample', () => {
    expect(sampleIndices(4)).toEqual([0, 1, 2, 3]);
    expect(sampleIndices(1)).toEqual([0]);
  });
});
