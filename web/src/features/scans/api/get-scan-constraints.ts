import { scanConstraintsSchema } from '@sixtyfold/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { env } from '@/config/env';
import { api } from '@/lib/api-client';
import { scanResultsKey } from './scan-results-key';

export interface ConstraintsQuery {
  /** `key` or `key@version`. */
  likelihood: string;
  /** Only the priors picked by hand; the API chooses the others from the axes. */
  priors: Record<string, 'uniform' | 'log'>;
}

/** The API's query keys: `likelihood` and one `prior.<axis>` per picked prior. */
function searchOf({ likelihood, priors }: ConstraintsQuery): Record<string, string> {
  return { likelihood, ...Object.fromEntries(Object.entries(priors).map(([axis, prior]) => [`prior.${axis}`, prior])) };
}

export const getScanConstraints = (scanId: number, query: ConstraintsQuery, signal?: AbortSignal) =>
  api.get(`/scans/${scanId}/constraints`, { query: searchOf(query), schema: scanConstraintsSchema, signal });

/** The same question as a CSV of the 1-D marginals, for a download link. */
export function constraintsCsvHref(scanId: number, query: ConstraintsQuery): string {
  const search = new URLSearchParams({ ...searchOf(query), format: 'csv' });
  return `${env.VITE_API_BASE_PATH}/scans/${scanId}/constraints?${search.toString()}`;
}

export const getScanConstraintsQueryOptions = (scanId: number, query: ConstraintsQuery) =>
  queryOptions({
    queryKey: [...scanResultsKey(scanId), 'constraints', query],
    queryFn: ({ signal }) => getScanConstraints(scanId, query, signal),
    placeholderData: keepPreviousData,
  });

export const useScanConstraints = (scanId: number, query: ConstraintsQuery) => useQuery(getScanConstraintsQueryOptions(scanId, query));
