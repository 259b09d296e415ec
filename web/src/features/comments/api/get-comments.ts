import { commentSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';

const commentListSchema = z.array(commentSchema);

/** Every comment key of a scan starts here, so a change refreshes its threads and counts together. */
export const scanCommentsKey = (scanId: number) => ['comments', scanId] as const;

/** The thread of the whole scan (pointIndex null) or of one point, oldest first. */
export const getComments = (scanId: number, pointIndex: number | null, signal?: AbortSignal) =>
  api.get(`/scans/${scanId}/comments`, { schema: commentListSchema, query: { pointIndex: pointIndex ?? undefined }, signal });

export const getCommentsQueryOptions = (scanId: number, pointIndex: number | null) =>
  queryOptions({
    queryKey: [...scanCommentsKey(scanId), 'thread', pointIndex ?? 'scan'],
    queryFn: ({ signal }) => getComments(scanId, pointIndex, signal),
  });

export const useComments = (scanId: number, pointIndex: number | null) => useQuery(getCommentsQueryOptions(scanId, pointIndex));
