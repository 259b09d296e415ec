import { commentCountsSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { scanCommentsKey } from './get-comments';

/** How many comments the scan and each of its points have (points without any are left out). */
export const getCommentCounts = (scanId: number, signal?: AbortSignal) =>
  api.get(`/scans/${scanId}/comments/counts`, { schema: commentCountsSchema, signal });

export const getCommentCountsQueryOptions = (scanId: number) =>
  queryOptions({
    queryKey: [...scanCommentsKey(scanId), 'counts'],
    queryFn: ({ signal }) => getCommentCounts(scanId, signal),
  });

export const useCommentCounts = (scanId: number) => useQuery(getCommentCountsQueryOptions(scanId));
