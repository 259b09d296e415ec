import { constraintRegionSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';

const regionListSchema = z.array(constraintRegionSchema);

/** The observational constraint regions a group uploaded, newest first. */
export const getConstraintRegions = (groupId: number, signal?: AbortSignal) =>
  api.get('/constraint-regions', { query: { groupId }, schema: regionListSchema, signal });

export const getConstraintRegionsQueryOptions = (groupId: number) =>
  queryOptions({
    queryKey: ['constraint-regions', 'group', groupId],
    queryFn: ({ signal }) => getConstraintRegions(groupId, signal),
  });

export const useConstraintRegions = (groupId: number) => useQuery(getConstraintRegionsQueryOptions(groupId));
