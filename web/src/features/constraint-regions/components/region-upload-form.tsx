import { Alert, Button, Field, Input, Stack } from '@chakra-ui/react';
import { zodResolver } from '@hookform/resolvers/zod';
import { constraintRegionUploadSchema, REGION_CSV_MAX_BYTES, type ConstraintRegion, type ConstraintRegionUpload } from '@sixtyfold/shared';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { FailureAlert } from '@/components/ui/failure-alert';
import { ApiRequestError } from '@/lib/api-client';
import { applyFieldErrors } from '@/lib/form-errors';
import { useUploadConstraintRegion } from '../api/upload-constraint-region';

type UploadInput = z.input<typeof constraintRegionUploadSchema>;

const FIELDS = ['name', 'source', 'confidenceLevel'] as const;

/** A member adds a region to the group from a CSV file of boundary vertices (format in DEVELOPERS.md). */
export function RegionUploadForm({ groupId }: { groupId: number }) {
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm<UploadInput, unknown, ConstraintRegionUpload>({
    resolver: zodResolver(constraintRegionUploadSchema),
    defaultValues: { groupId, name: '', source: '', confidenceLevel: '' },
  });
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  // A new key empties the file input after an upload (its value cannot be set).
  const [fileInputKey, setFileInputKey] = useState(0);
  const [uploaded, setUploaded] = useState<ConstraintRegion | null>(null);
  const upload = useUploadConstraintRegion();

  const checkFile = () => {
    if (!file) return 'Choose the CSV file of the region’s boundary.';
    // The API refuses it with a 413 too; saying so here saves sending a large file for nothing.
    if (file.size > REGION_CSV_MAX_BYTES) return `The file is ${(file.size / 1024 / 1024).toFixed(1)} MB; a region file has at most 1 MB.`;
    return null;
  };

  const onSubmit = handleSubmit(
    (fields) => {
      const problem = checkFile();
      setFileError(problem);
      if (problem || !file) return;
      setUploaded(null);
      upload.mutate(
        { ...fields, file },
        {
          onSuccess: (region) => {
            setUploaded(region);
            reset();
            setFile(null);
            setFileInputKey((k) => k + 1);
          },
          onError: (error) => applyFieldErrors(error, setError),
        },
      );
    },
    () => setFileError(checkFile()),
  );

  // Field problems show beside their fields; everything else (the file's content, size, type) above the button.
  const apiError = upload.error instanceof ApiRequestError ? upload.error : null;
  const refusal = upload.isError && !FIELDS.some((field) => apiError?.fieldErrors[field]);
  const line = apiError?.line;

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Upload a constraint region">
      <Stack gap="4">
        {uploaded && (
          <Alert.Root status="success" variant="subtle" borderRadius="md">
            <Alert.Indicator />
            <Alert.Title fontWeight="400">
              Uploaded “{uploaded.name}” with {uploaded.vertices.length.toLocaleString('en-US')} vertices.
            </Alert.Title>
          </Alert.Root>
        )}
        <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ base: 'stretch', md: 'start' }}>
          <Field.Root invalid={!!errors.name} flex="1">
            <Field.Label>Name</Field.Label>
            <Input bg="bg.panel" autoComplete="off" placeholder="e.g. Survey B, n_s–r 95%" {...register('name')} />
            <Field.ErrorText>{errors.name?.message}</Field.ErrorText>
          </Field.Root>
          <Field.Root invalid={!!errors.confidenceLevel} maxW={{ md: '44' }}>
            <Field.Label>Confidence level</Field.Label>
            <Input bg="bg.panel" inputMode="decimal" autoComplete="off" placeholder="0.95" {...register('confidenceLevel')} />
            <Field.HelperText>Between 0 and 1.</Field.HelperText>
            <Field.ErrorText>{errors.confidenceLevel?.message}</Field.ErrorText>
          </Field.Root>
        </Stack>
        <Field.Root invalid={!!errors.source}>
          <Field.Label>Source</Field.Label>
          <Input bg="bg.panel" autoComplete="off" placeholder="paper or data release the outline comes from" {...register('source')} />
          <Field.ErrorText>{errors.source?.message}</Field.ErrorText>
        </Field.Root>
        <Field.Root invalid={!!fileError}>
          <Field.Label>Region file (.csv, at most 1 MB)</Field.Label>
          <Input
            key={fileInputKey}
            type="file"
            accept=".csv,text/csv"
            p="1"
            onChange={(event) => {
              upload.reset();
              setFileError(null);
              setFile(event.target.files?.[0] ?? null);
            }}
          />
          <Field.HelperText>Header n_s,r, then one boundary vertex per line in order around the outline; lines starting with # are notes.</Field.HelperText>
          <Field.ErrorText>{fileError}</Field.ErrorText>
        </Field.Root>
        {refusal && (
          <FailureAlert title={line !== undefined ? `The file was refused at line ${line}` : 'The region was not uploaded'}>{upload.error.message}</FailureAlert>
        )}
        <Button type="submit" variant="outline" alignSelf="start" loading={upload.isPending} loadingText="Uploading…">
          Upload region
        </Button>
      </Stack>
    </form>
  );
}
