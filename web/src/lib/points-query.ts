import { POINT_OUTPUTS } from '@sixtyfold/shared';

/**
 * A points query as the API names its keys (sort, ns_min, input.f_max, ...): the query of a scan's
 * `/points` and of a refined grid's merged `/refinement/points`.
 */
export type PointsQuery = Record<string, string>;

/** A column of the points table: the index, an axis input (`input.<parameter>`) or an output. */
export type PointColumn = string;

export interface ColumnFilter {
  column: PointColumn;
  min?: string;
  max?: string;
}

const RANGE_KEY = /^((?:input\.[A-Za-z][A-Za-z0-9_]*)|[A-Za-z]+)_(min|max)$/;
const isOutput = (name: string) => (POINT_OUTPUTS as readonly string[]).includes(name);

/**
 * The points query kept in the address: the same keys the API reads, so a filtered table can be
 * bookmarked or sent, and its export link is the same query with `format` added.
 */
export function readPointsQuery(params: URLSearchParams): PointsQuery {
  const query: PointsQuery = {};
  for (const [key, value] of params) {
    if (value === '') continue;
    if (key === 'page' || key === 'sort' || key === 'order' || key === 'status' || key === 'likelihood') query[key] = value;
    const range = RANGE_KEY.exec(key);
    if (range && (range[1].startsWith('input.') || isOutput(range[1]))) query[key] = value;
  }
  return query;
}

/** The column filters of a query, one entry per column. */
export function filtersOf(query: PointsQuery): ColumnFilter[] {
  const byColumn = new Map<string, ColumnFilter>();
  for (const [key, value] of Object.entries(query)) {
    const range = RANGE_KEY.exec(key);
    if (!range) continue;
    const filter = byColumn.get(range[1]) ?? { column: range[1] };
    filter[range[2] as 'min' | 'max'] = value;
    byColumn.set(range[1], filter);
  }
  return [...byColumn.values()];
}

/** Sets (or with neither bound, removes) one column's filter; any change goes back to page 1. */
export function withFilter(query: PointsQuery, filter: ColumnFilter): PointsQuery {
  const next = withoutFilter(query, filter.column);
  if (filter.min) next[`${filter.column}_min`] = filter.min;
  if (filter.max) next[`${filter.column}_max`] = filter.max;
  return next;
}

export function withoutFilter(query: PointsQuery, column: PointColumn): PointsQuery {
  const next = { ...query };
  delete next[`${column}_min`];
  delete next[`${column}_max`];
  delete next.page;
  return next;
}

/** Clicking a column header: sort by it ascending, or flip the order if it already sorts. */
export function toggledSort(query: PointsQuery, column: PointColumn): PointsQuery {
  const current = query.sort ?? 'pointIndex';
  const order = current === column && (query.order ?? 'asc') === 'asc' ? 'desc' : 'asc';
  const next: PointsQuery = { ...query, sort: column, order };
  delete next.page;
  return next;
}
