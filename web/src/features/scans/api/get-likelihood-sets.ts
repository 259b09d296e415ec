import { likelihoodSetEntrySchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';

const likelihoodSetListSchema = z.array(likelihoodSetEntrySchema);

/** The set judged with when none is picked. */
export const DEFAULT_LIKELIHOOD = 'planck18-bk18';

export const getLikelihoodSets = (signal?: AbortSignal) => api.get('/likelihood-sets', { schema: likelihoodSetListSchema, signal });

export const getLikelihoodSetsQueryOptions = () =>
  queryOptions({
    queryKey: ['likelihood-sets'],
    queryFn: ({ signal }) => getLikelihoodSets(signal),
  });

export const useLikelihoodSets = () => useQuery(getLikelihoodSetsQueryOptions());
