import { Heading, HStack, Link, SimpleGrid, Stack, Table, Text } from '@chakra-ui/react';
import type { EvidenceComparison, ScanDetail } from '@sixtyfold/shared';
import { Link as RouterLink } from 'react-router-dom';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Panel } from '@/components/ui/panel';
import { SelectField } from '@/components/ui/select-field';
import { paths } from '@/config/paths';
import { formatNumber } from '@/lib/format-number';
import { useEvidenceComparison } from '../../api/get-evidence-comparison';
import { useViewParams } from '../../hooks/use-view-params';

const number = (value: number | null, digits: number) => formatNumber(value, digits, 'power');

/**
 * Model comparison: each grid scan's evidence under Planck and P-ACT-LB side by side, ranked, with
 * ln B against a reference scan (`?reference=`, the first scan unless picked) in the words of
 * Kass & Raftery. A scan over a list of points has no prior volume, so it is left out and named.
 */
export function EvidenceTables({ scans }: { scans: ScanDetail[] }) {
  const [params, update] = useViewParams();
  const grids = scans.filter((scan) => scan.spec.axes);
  const lists = scans.filter((scan) => !scan.spec.axes);
  const asked = Number(params.get('reference'));
  const reference = grids.some((scan) => scan.id === asked) ? asked : grids[0]?.id;

  return (
    <Stack gap="3">
      <Heading as="h2" size="md" color="ink.900">
        Evidence and Bayes factors
      </Heading>
      {lists.length > 0 && (
        <Text color="fg.muted" fontSize="sm">
          Left out: {lists.map((scan) => scan.name).join(', ')} (a list of points has no prior volume to average the likelihood over).
        </Text>
      )}
      {reference === undefined ? (
        <Text color="fg.muted">None of these scans is a grid, so none has an evidence.</Text>
      ) : (
        <>
          <Panel p={{ base: '3', md: '4' }}>
            <HStack gap="3" wrap="wrap" align="end">
              <SelectField
                label="Reference scan"
                value={String(reference)}
                options={grids.map((scan) => ({ value: String(scan.id), label: scan.name }))}
                onChange={(next) => update({ reference: next === String(grids[0].id) ? null : next })}
                minW="56"
              />
            </HStack>
          </Panel>
          <EvidenceResult ids={grids.map((scan) => scan.id)} reference={reference} />
        </>
      )}
    </Stack>
  );
}

function EvidenceResult({ ids, reference }: { ids: number[]; reference: number }) {
  const comparison = useEvidenceComparison(ids, reference);
  if (comparison.isError) return <ErrorState title="Could not compare the evidence" error={comparison.error} onRetry={() => comparison.refetch()} />;
  if (!comparison.data) return <LoadingState label="Computing the evidence…" />;
  const { note, sets } = comparison.data;
  return (
    <Stack gap="3">
      <Text fontSize="sm" color="fg.muted">
        {note}
      </Text>
      <SimpleGrid columns={{ base: 1, lg: 2 }} gap="4">
        {sets.map((set) => (
          <EvidenceTable key={set.likelihood.ref} set={set} />
        ))}
      </SimpleGrid>
    </Stack>
  );
}

function EvidenceTable({ set }: { set: EvidenceComparison['sets'][number] }) {
  const { likelihood } = set;
  const title = likelihood.kind === 'set' ? `${likelihood.name} (${likelihood.key} v${likelihood.version})` : likelihood.name;
  return (
    <Panel p={{ base: '3', md: '4' }} minW="0">
      <Stack gap="2">
        <Heading as="h3" size="sm" color="ink.900">
          {title}
        </Heading>
        <Text fontSize="xs" color="fg.muted">
          {likelihood.statement}
          {likelihood.kind === 'set' && ` Sources: ${likelihood.sources.map((source) => `${source.label} (arXiv:${source.arxiv})`).join('; ')}.`}
        </Text>
        <Table.ScrollArea>
          <Table.Root size="sm" aria-label={`Evidence under ${title}`}>
            <Table.Header>
              <Table.Row bg="bg.subtle">
                <Table.ColumnHeader>Rank</Table.ColumnHeader>
                <Table.ColumnHeader>Scan</Table.ColumnHeader>
                <Table.ColumnHeader>ln Z</Table.ColumnHeader>
                <Table.ColumnHeader>ln B</Table.ColumnHeader>
                <Table.ColumnHeader>2 ln B</Table.ColumnHeader>
                <Table.ColumnHeader>Against the reference</Table.ColumnHeader>
              </Table.Row>
            </Table.Header>
            <Table.Body>
              {set.scans.map((row) => (
                <Table.Row key={row.scanId}>
                  <Table.Cell fontFamily="mono">{row.rank}</Table.Cell>
                  <Table.Cell>
                    <Link asChild>
                      <RouterLink to={`${paths.scan.getHref(row.scanId, 'constraints')}&likelihood=${likelihood.ref}`}>{row.name}</RouterLink>
                    </Link>
                  </Table.Cell>
                  <Table.Cell fontFamily="mono" whiteSpace="nowrap">
                    {row.lnZ === null ? '—' : `${number(row.lnZ, 4)} ± ${number(row.lnZError, 2)}`}
                  </Table.Cell>
                  <Table.Cell fontFamily="mono">{number(row.lnB, 3)}</Table.Cell>
                  <Table.Cell fontFamily="mono">{number(row.twoLnB, 3)}</Table.Cell>
                  <Table.Cell>{row.verdict ?? (row.lnZ === null ? 'no judged point' : '—')}</Table.Cell>
                </Table.Row>
              ))}
            </Table.Body>
          </Table.Root>
        </Table.ScrollArea>
      </Stack>
    </Panel>
  );
}
