import { evidenceComparisonSchema } from '@sixtyfold/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** Planck 2018 + BICEP/Keck and P-ACT-LB + BICEP/Keck side by side unless asked otherwise. */
export const COMPARED_LIKELIHOODS = ['planck18-bk18', 'pact-lb-bk18'];

export const getEvidenceComparison = (ids: number[], reference: number, signal?: AbortSignal) =>
  api.get('/scans/evidence', {
    query: { ids: ids.join(','), likelihoods: COMPARED_LIKELIHOODS.join(','), reference },
    schema: evidenceComparisonSchema,
    signal,
  });

export const getEvidenceComparisonQueryOptions = (ids: number[], reference: number) =>
  queryOptions({
    queryKey: ['scans', 'evidence', { ids, reference }],
    queryFn: ({ signal }) => getEvidenceComparison(ids, reference, signal),
    placeholderData: keepPreviousData,
  });

export const useEvidenceComparison = (ids: number[], reference: number) => useQuery(getEvidenceComparisonQueryOptions(ids, reference));
