import { scanArchiveSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { env } from '@/config/env';
import { api } from '@/lib/api-client';

const archiveListSchema = z.array(scanArchiveSchema);

export const getArchives = (signal?: AbortSignal) => api.get('/maintenance/archives', { schema: archiveListSchema, signal });

export const getArchivesQueryOptions = () =>
  queryOptions({
    queryKey: ['maintenance', 'archives'],
    queryFn: ({ signal }) => getArchives(signal),
  });

export const useArchives = () => useQuery(getArchivesQueryOptions());

/** A plain link: the browser downloads the file with the session cookie. */
export const archiveDownloadHref = (archiveId: number) => `${env.VITE_API_BASE_PATH}/maintenance/archives/${archiveId}/download`;
