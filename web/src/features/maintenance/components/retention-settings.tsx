import { Button, chakra, Field, Input, Stack, Text } from '@chakra-ui/react';
import { zodResolver } from '@hookform/resolvers/zod';
import { retentionPolicySchema, type RetentionPolicy } from '@sixtyfold/shared';
import { useRef } from 'react';
import { useForm } from 'react-hook-form';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { SaveStatus } from '@/components/ui/save-status';
import { applyFieldErrors } from '@/lib/form-errors';
import { useRetention } from '../api/get-retention';
import { useUpdateRetention } from '../api/update-retention';
import { PrunableStatusesField } from './prunable-statuses-field';

const DEFAULT_KEEP_DAYS = 90;

/** The policy in one sentence, for everyone who can see the group. */
export function retentionSummary({ keepDays, statuses }: RetentionPolicy): string {
  if (keepDays === null) return 'Scans are kept until someone deletes them.';
  const days = keepDays === 1 ? '1 day' : `${keepDays.toLocaleString('en-US')} days`;
  const which = new Intl.ListFormat('en-US', { type: 'conjunction' }).format(statuses);
  return `Every night, ${which} scans older than ${days} (counted from when they finished) are archived and deleted.`;
}

interface RetentionSettingsProps {
  groupId: number;
  /** Leads of the group and site admins; the API checks again. */
  canChange: boolean;
}

/** A group's retention policy: read by every member, changed by its leads. */
export function RetentionSettings({ groupId, canChange }: RetentionSettingsProps) {
  const retention = useRetention(groupId);
  if (retention.isPending) return <LoadingState label="Loading the retention policy…" />;
  if (retention.isError) return <ErrorState title="Could not load the retention policy" error={retention.error} onRetry={() => retention.refetch()} />;
  return (
    <Stack gap="4">
      <Text fontSize="sm">{retentionSummary(retention.data)}</Text>
      {canChange ? (
        <RetentionForm groupId={groupId} policy={retention.data} />
      ) : (
        <Text fontSize="sm" color="fg.muted">
          Only the group’s leads and site administrators can change this.
        </Text>
      )}
    </Stack>
  );
}

// react-hook-form passes setValue's null through here too: null is "off", an emptied field is missing.
const daysValue = (value: string | number | null) => (value === null ? null : value === '' || value === undefined ? undefined : Number(value));

function RetentionForm({ groupId, policy }: { groupId: number; policy: RetentionPolicy }) {
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    watch,
    formState: { errors },
  } = useForm<RetentionPolicy>({ resolver: zodResolver(retentionPolicySchema), defaultValues: policy });
  const update = useUpdateRetention(groupId);
  // Switching retention off and on again brings back the days last typed.
  const lastDays = useRef(policy.keepDays ?? DEFAULT_KEEP_DAYS);
  const keepDays = watch('keepDays');
  const on = keepDays !== null;

  const toggle = (checked: boolean) => {
    if (checked) {
      setValue('keepDays', lastDays.current);
    } else {
      if (typeof keepDays === 'number' && Number.isInteger(keepDays) && keepDays > 0) lastDays.current = keepDays;
      setValue('keepDays', null, { shouldValidate: true });
    }
  };

  const onSubmit = handleSubmit((values) =>
    update.mutate(values, {
      onError: (error) => applyFieldErrors(error, setError),
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Retention">
      <Stack gap="4">
        <SaveStatus mutation={update} errorTitle="Could not save the retention policy" />
        <chakra.label display="inline-flex" alignItems="center" gap="2" fontSize="sm" fontWeight="500">
          <input type="checkbox" checked={on} onChange={(event) => toggle(event.target.checked)} />
          Delete old scans automatically
        </chakra.label>
        {/* Off, the fields are unmounted and keep their values: the policy stores statuses either way. */}
        {on && (
          <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ base: 'stretch', md: 'start' }}>
            <Field.Root invalid={!!errors.keepDays} maxW={{ md: '48' }}>
              <Field.Label>Keep for (days)</Field.Label>
              <Input type="number" min={1} bg="bg.panel" {...register('keepDays', { setValueAs: daysValue })} />
              <Field.HelperText>Counted from when a scan finished (a draft: when it was created).</Field.HelperText>
              <Field.ErrorText>{errors.keepDays?.message}</Field.ErrorText>
            </Field.Root>
            <PrunableStatusesField registration={register('statuses')} error={errors.statuses?.message} flex="1" />
          </Stack>
        )}
        <Text fontSize="xs" color="fg.muted">
          Each scan is archived (its record and every point) before it is deleted.
        </Text>
        <Button type="submit" variant="outline" alignSelf="start" loading={update.isPending} loadingText="Saving…">
          Save retention
        </Button>
      </Stack>
    </form>
  );
}
