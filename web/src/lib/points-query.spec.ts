import { filtersOf, readPointsQuery, toggledSort, withFilter, withoutFilter } from './points-query';

describe('points query in the address', () => {
  it('keeps only the keys the API reads', () => {
    const params = new URLSearchParams('view=points&page=2&sort=input.f&order=desc&ns_min=0.96&input.nStar_max=55&x=f&bogus_min=1&status=failed');
    expect(readPointsQuery(params)).toEqual({
      page: '2', sort: 'input.f', order: 'desc', ns_min: '0.96', 'input.nStar_max': '55', status: 'failed',
    });
  });

  it('groups range keys into one filter per column', () => {
    expect(filtersOf({ ns_min: '0.96', ns_max: '0.97', 'input.f_max': '7', sort: 'r' })).toEqual([
      { column: 'ns', min: '0.96', max: '0.97' },
      { column: 'input.f', max: '7' },
    ]);
  });

  it('replaces a column filter, drops empty bounds and returns to page 1', () => {
    const query = { page: '3', ns_min: '0.9', ns_max: '1' };
    expect(withFilter(query, { column: 'ns', min: '0.96' })).toEqual({ ns_min: '0.96' });
    expect(withoutFilter(query, 'ns')).toEqual({});
  });

  it('sorts ascending first, then flips', () => {
    const once = toggledSort({ page: '2' }, 'r');
    expect(once).toEqual({ sort: 'r', order: 'asc' });
    expect(toggledSort(once, 'r')).toEqual({ sort: 'r', order: 'desc' });
    expect(toggledSort({ sort: 'r', order: 'desc' }, 'ns')).toEqual({ sort: 'ns', order: 'asc' });
  });
});
