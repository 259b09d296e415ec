import { scanProvenanceAnswerSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { scanResultsKey } from './scan-results-key';

export const getScanProvenance = (scanId: number, signal?: AbortSignal) =>
  api.get(`/scans/${scanId}/provenance`, { schema: scanProvenanceAnswerSchema, signal });

// Under the results key: chunk runs arrive with the points, so whatever refreshes the results refreshes these.
export const getScanProvenanceQueryOptions = (scanId: number) =>
  queryOptions({
    queryKey: [...scanResultsKey(scanId), 'provenance'],
    queryFn: ({ signal }) => getScanProvenance(scanId, signal),
  });

export const useScanProvenance = (scanId: number) => useQuery(getScanProvenanceQueryOptions(scanId));
