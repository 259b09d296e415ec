import { formatScanIds, parseScanIds } from './scan-ids-param';

describe('parseScanIds', () => {
  it('reads ids in order and drops junk and repeats', () => {
    expect(parseScanIds('3, 1,x,3,-2,0,1.5')).toEqual([3, 1]);
  });

  it('keeps at most four', () => {
    expect(parseScanIds('1,2,3,4,5')).toEqual([1, 2, 3, 4]);
  });

  it('round-trips with formatScanIds', () => {
    expect(parseScanIds(formatScanIds([7, 9]))).toEqual([7, 9]);
    expect(parseScanIds(null)).toEqual([]);
  });
});
