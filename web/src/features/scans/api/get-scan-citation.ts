import { scanCitationSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { env } from '@/config/env';
import { api } from '@/lib/api-client';

const searchOf = (likelihood: string | null): Record<string, string> => (likelihood ? { likelihood } : {});

export const getScanCitation = (scanId: number, likelihood: string | null, signal?: AbortSignal) =>
  api.get(`/scans/${scanId}/citation`, { query: searchOf(likelihood), schema: scanCitationSchema, signal });

/** The same citation as a .bib file, for a download link. */
export function scanCitationBibHref(scanId: number, likelihood: string | null): string {
  const search = new URLSearchParams({ ...searchOf(likelihood), format: 'bib' });
  return `${env.VITE_API_BASE_PATH}/scans/${scanId}/citation?${search.toString()}`;
}

export const getScanCitationQueryOptions = (scanId: number, likelihood: string | null) =>
  queryOptions({
    queryKey: ['scans', 'citation', scanId, likelihood],
    queryFn: ({ signal }) => getScanCitation(scanId, likelihood, signal),
  });

export const useScanCitation = (scanId: number, likelihood: string | null) => useQuery(getScanCitationQueryOptions(scanId, likelihood));
