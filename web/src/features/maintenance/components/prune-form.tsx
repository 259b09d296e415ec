import { Alert, Box, Button, chakra, Field, Input, NativeSelect, Stack, Table, Text } from '@chakra-ui/react';
import { zodResolver } from '@hookform/resolvers/zod';
import { pruneFilterSchema, type PruneFilter, type PrunePlan, type PruneResult } from '@sixtyfold/shared';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { DateTime } from '@/components/ui/date-time';
import { FailureAlert } from '@/components/ui/failure-alert';
import { formatBytes } from '@/lib/format-bytes';
import { useDryRunPrune, usePruneScans } from '../api/prune-scans';
import { PrunableStatusesField } from './prunable-statuses-field';

type PruneFilterInput = z.input<typeof pruneFilterSchema>;

interface Option {
  id: number;
  name: string;
}

interface PruneFormProps {
  groups: Option[];
  owners: Option[];
}

const optionalNumber = (value: string | number) => (value === '' || value === undefined ? undefined : Number(value));
const optionalText = (value: string) => (value.trim() === '' ? undefined : value);

/**
 * A prune in two steps: the dry run lists exactly what the filter selects now, and the prune
 * sends that filter with those ids, so the API refuses if anything else would go.
 */
export function PruneForm({ groups, owners }: PruneFormProps) {
  const {
    register,
    handleSubmit,
    formState: { errors },
  } = useForm<PruneFilterInput, unknown, PruneFilter>({
    resolver: zodResolver(pruneFilterSchema),
    defaultValues: { olderThanDays: 90, ageBasis: 'finished', statuses: ['completed', 'failed', 'cancelled'] },
  });
  const dryRun = useDryRunPrune();
  const [shown, setShown] = useState<{ filter: PruneFilter; plan: PrunePlan } | null>(null);
  const [confirming, setConfirming] = useState(false);
  const [done, setDone] = useState<PruneResult | null>(null);
  const prune = usePruneScans();

  const onSubmit = handleSubmit((filter) => {
    setDone(null);
    dryRun.mutate(filter, { onSuccess: (plan) => setShown({ filter, plan }) });
  });

  const confirm = () => {
    if (!shown) return;
    prune.mutate(
      { ...shown.filter, scanIds: shown.plan.items.map((i) => i.scanId) },
      {
        onSuccess: (result) => {
          setDone(result);
          setShown(null);
          setConfirming(false);
        },
      },
    );
  };

  return (
    <Stack gap="5">
      <form onSubmit={onSubmit} noValidate aria-label="Choose scans to prune">
        <Stack gap="4">
          <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ base: 'stretch', md: 'start' }}>
            <Field.Root invalid={!!errors.groupId} flex="1">
              <Field.Label>Group</Field.Label>
              <NativeSelect.Root>
                <NativeSelect.Field bg="bg.panel" {...register('groupId', { setValueAs: optionalNumber })}>
                  <option value="">Every group</option>
                  {groups.map((g) => (
                    <option key={g.id} value={g.id}>
                      {g.name}
                    </option>
                  ))}
                </NativeSelect.Field>
                <NativeSelect.Indicator />
              </NativeSelect.Root>
            </Field.Root>
            <Field.Root invalid={!!errors.ownerId} flex="1">
              <Field.Label>Owner</Field.Label>
              <NativeSelect.Root>
                <NativeSelect.Field bg="bg.panel" {...register('ownerId', { setValueAs: optionalNumber })}>
                  <option value="">Anyone</option>
                  {owners.map((o) => (
                    <option key={o.id} value={o.id}>
                      {o.name}
                    </option>
                  ))}
                </NativeSelect.Field>
                <NativeSelect.Indicator />
              </NativeSelect.Root>
            </Field.Root>
            <Field.Root invalid={!!errors.tag} flex="1">
              <Field.Label>Tag</Field.Label>
              <Input bg="bg.panel" placeholder="any tag" autoComplete="off" {...register('tag', { setValueAs: optionalText })} />
              <Field.ErrorText>{errors.tag?.message}</Field.ErrorText>
            </Field.Root>
          </Stack>
          <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ base: 'stretch', md: 'start' }}>
            <Field.Root invalid={!!errors.olderThanDays} flex="1">
              <Field.Label>Older than (days)</Field.Label>
              <Input type="number" min={0} bg="bg.panel" {...register('olderThanDays', { setValueAs: optionalNumber })} />
              <Field.HelperText>Leave empty for any age.</Field.HelperText>
              <Field.ErrorText>{errors.olderThanDays?.message}</Field.ErrorText>
            </Field.Root>
            <Field.Root flex="1">
              <Field.Label>Counted from</Field.Label>
              <NativeSelect.Root>
                <NativeSelect.Field bg="bg.panel" {...register('ageBasis')}>
                  <option value="finished">when it finished</option>
                  <option value="created">when it was created</option>
                </NativeSelect.Field>
                <NativeSelect.Indicator />
              </NativeSelect.Root>
            </Field.Root>
            <PrunableStatusesField registration={register('statuses')} error={errors.statuses?.message} flex="1" />
          </Stack>
          <Button type="submit" variant="outline" alignSelf="start" loading={dryRun.isPending} loadingText="Listing…">
            List what would go
          </Button>
        </Stack>
      </form>

      {dryRun.isError && (
        <FailureAlert title="Could not list the scans">{dryRun.error.message}</FailureAlert>
      )}
      {done && (
        <Alert.Root status="success" variant="subtle" borderRadius="md" role="status">
          <Alert.Indicator />
          <Alert.Content>
            <Alert.Title>
              Deleted {done.deleted.length} scan{done.deleted.length === 1 ? '' : 's'}
            </Alert.Title>
            <Alert.Description>Each was archived first; the archives are listed below.</Alert.Description>
          </Alert.Content>
        </Alert.Root>
      )}

      {shown && (
        <Box as="section" aria-label="Dry run">
          {shown.plan.items.length === 0 ? (
            <Text color="fg.muted">No scan matches this filter; nothing would be deleted.</Text>
          ) : (
            <Stack gap="3">
              <Text>
                {shown.plan.items.length} scan{shown.plan.items.length === 1 ? '' : 's'} would go: {shown.plan.totalPoints} points, about{' '}
                {formatBytes(shown.plan.totalBytes)} (each scan's share of the points table).
              </Text>
              <PlanTable plan={shown.plan} />
              <Button colorPalette="red" alignSelf="start" onClick={() => setConfirming(true)}>
                Prune these {shown.plan.items.length} scans…
              </Button>
            </Stack>
          )}
        </Box>
      )}

      <ConfirmDialog
        open={confirming && shown !== null}
        title={`Delete ${shown?.plan.items.length ?? 0} scans?`}
        confirmLabel="Archive and delete"
        busyLabel="Deleting…"
        busy={prune.isPending}
        error={prune.isError ? { title: 'Nothing was deleted', message: prune.error.message } : null}
        onConfirm={confirm}
        onClose={() => {
          prune.reset();
          setConfirming(false);
        }}
      >
        <Stack gap="3">
          <Text>These scans and all their points are deleted. Each is written to an archive first, which admins and the group's leads can download.</Text>
          <chakra.ul ps="5" maxH="48" overflowY="auto" aria-label="Scans to delete">
            {shown?.plan.items.map((i) => (
              <li key={i.scanId}>
                {i.name} (#{i.scanId}, {i.groupName}, {i.points} points)
              </li>
            ))}
          </chakra.ul>
        </Stack>
      </ConfirmDialog>
    </Stack>
  );
}

function PlanTable({ plan }: { plan: PrunePlan }) {
  return (
    <Table.ScrollArea maxH="md" borderWidth="1px" borderRadius="md">
      <Table.Root size="sm" stickyHeader aria-label="Scans that would be deleted">
        <Table.Header>
          <Table.Row bg="bg.subtle">
            <Table.ColumnHeader>Scan</Table.ColumnHeader>
            <Table.ColumnHeader>Group</Table.ColumnHeader>
            <Table.ColumnHeader>Owner</Table.ColumnHeader>
            <Table.ColumnHeader>Status</Table.ColumnHeader>
            <Table.ColumnHeader>Finished</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">Points</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">Size</Table.ColumnHeader>
          </Table.Row>
        </Table.Header>
        <Table.Body>
          {plan.items.map((i) => (
            <Table.Row key={i.scanId}>
              <Table.Cell>
                {i.name} <Text as="span" color="fg.muted">#{i.scanId}</Text>
              </Table.Cell>
              <Table.Cell>{i.groupName}</Table.Cell>
              <Table.Cell>{i.ownerName}</Table.Cell>
              <Table.Cell>{i.status}</Table.Cell>
              <Table.Cell fontSize="sm" color="fg.muted">
                {i.finishedAt ? <DateTime iso={i.finishedAt} /> : 'never ran'}
              </Table.Cell>
              <Table.Cell textAlign="end">{i.points}</Table.Cell>
              <Table.Cell textAlign="end">{formatBytes(i.bytes)}</Table.Cell>
            </Table.Row>
          ))}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
