import { scanDetailSchema, type CreateScan, type ScanDetail } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { scanLaunched } from './create-scan';

/**
 * Submits a scan over the points of a file: the settings as JSON in `spec`, the file itself as
 * `points`. The API reads the file again with the reader the form used.
 */
export function uploadScan({ spec, file }: { spec: CreateScan; file: File }): Promise<ScanDetail> {
  const { axes: _axes, pointList: _points, ...settings } = spec;
  const form = new FormData();
  form.set('spec', JSON.stringify(settings));
  form.set('points', file);
  return api.upload('/scans/upload', form, { schema: scanDetailSchema });
}

export function useUploadScan({ onSuccess }: { onSuccess?: (scan: ScanDetail) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: uploadScan, onSuccess: (scan) => scanLaunched(queryClient, scan, onSuccess) });
}
