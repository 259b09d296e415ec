import { Code, DataList, Heading, Stack, Table, Text } from '@chakra-ui/react';
import type { ScanProvenanceAnswer } from '@sixtyfold/shared';
import type { ReactNode } from 'react';
import { DateTime } from '@/components/ui/date-time';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Panel } from '@/components/ui/panel';
import { useScanProvenance } from '../api/get-scan-provenance';
import { ScanCitation } from './scan-citation';
import { ScanReproducibility } from './scan-reproducibility';

const mono = { fontFamily: 'mono' } as const;
const NOT_RECORDED = 'not recorded';

/** A commit id as people compare them: its first 12 digits, the whole id on hover. */
function Commit({ id }: { id: string }) {
  return (
    <Text as="span" {...mono} title={id}>
      {/^[0-9a-f]{40}$/.test(id) ? id.slice(0, 12) : id}
    </Text>
  );
}

/** "How this was computed": the submitting build, the engine's settings, the spec hash and the workers of the chunks. */
export function ScanProvenancePanel({ scanId, canCheckReproducibility }: { scanId: number; canCheckReproducibility: boolean }) {
  const provenance = useScanProvenance(scanId);
  if (provenance.isPending) return <LoadingState label="Loading how the scan was computed…" />;
  if (provenance.isError) return <ErrorState title="Could not load how the scan was computed" error={provenance.error} onRetry={() => provenance.refetch()} />;
  return (
    <ProvenanceDetails provenance={provenance.data}>
      <ScanReproducibility scanId={scanId} canCheck={canCheckReproducibility} />
      <ScanCitation scanId={scanId} />
    </ProvenanceDetails>
  );
}

/** The recorded provenance; `children` (the reproducibility check, the citation) follow it in the same panel. */
export function ProvenanceDetails({ provenance, children }: { provenance: ScanProvenanceAnswer; children?: ReactNode }) {
  const { recorded, workers, runs, runsRecorded } = provenance;
  return (
    <Panel as="section" aria-labelledby="scan-provenance" p={{ base: '4', md: '5' }}>
      <Heading as="h2" id="scan-provenance" size="sm" color="ink.900" mb="3">
        How this was computed
      </Heading>
      <Stack gap="5">
        <DataList.Root orientation="horizontal" size="sm" gap="2.5">
          <DataList.Item>
            <DataList.ItemLabel>Engine</DataList.ItemLabel>
            <DataList.ItemValue>
              {recorded ? (
                <Text as="span">
                  <Text as="span" {...mono}>{recorded.engineVersion}</Text>, commit <Commit id={recorded.commit} />
                </Text>
              ) : (
                NOT_RECORDED
              )}
            </DataList.ItemValue>
          </DataList.Item>
          <DataList.Item>
            <DataList.ItemLabel>Node</DataList.ItemLabel>
            <DataList.ItemValue {...mono}>{recorded?.node ?? NOT_RECORDED}</DataList.ItemValue>
          </DataList.Item>
          <DataList.Item>
            <DataList.ItemLabel>Spec SHA-256</DataList.ItemLabel>
            <DataList.ItemValue {...mono} wordBreak="break-all">{recorded?.specSha256 ?? NOT_RECORDED}</DataList.ItemValue>
          </DataList.Item>
          <DataList.Item alignItems="start">
            <DataList.ItemLabel>Options</DataList.ItemLabel>
            <DataList.ItemValue>
              {recorded ? (
                <Code as="pre" display="block" whiteSpace="pre-wrap" p="2" aria-label="Engine options">
                  {JSON.stringify(recorded.engineOptions, null, 2)}
                </Code>
              ) : (
                NOT_RECORDED
              )}
            </DataList.ItemValue>
          </DataList.Item>
        </DataList.Root>
        {!runsRecorded ? (
          <Text color="fg.muted">Workers: {NOT_RECORDED} (the scan was stored before Sixtyfold recorded them).</Text>
        ) : workers.length === 0 ? (
          <Text color="fg.muted">No chunk has been stored yet.</Text>
        ) : (
          <>
            <Table.Root size="sm" aria-label="Workers">
              <Table.Header>
                <Table.Row>
                  <Table.ColumnHeader>Worker</Table.ColumnHeader>
                  <Table.ColumnHeader>Engine</Table.ColumnHeader>
                  <Table.ColumnHeader>Node</Table.ColumnHeader>
                  <Table.ColumnHeader textAlign="end">Chunk runs</Table.ColumnHeader>
                  <Table.ColumnHeader textAlign="end">Points</Table.ColumnHeader>
                </Table.Row>
              </Table.Header>
              <Table.Body>
                {workers.map((w) => (
                  <Table.Row key={`${w.worker}|${w.commit}|${w.node}`}>
                    <Table.Cell {...mono}>{w.worker}</Table.Cell>
                    <Table.Cell>
                      <Text as="span" {...mono}>{w.engineVersion}</Text> <Commit id={w.commit} />
                    </Table.Cell>
                    <Table.Cell {...mono}>{w.node}</Table.Cell>
                    <Table.Cell textAlign="end">{w.runs.toLocaleString('en-US')}</Table.Cell>
                    <Table.Cell textAlign="end">{w.points.toLocaleString('en-US')}</Table.Cell>
                  </Table.Row>
                ))}
              </Table.Body>
            </Table.Root>
            <details>
              <summary>Every chunk run ({runs.length.toLocaleString('en-US')})</summary>
              <Table.Root size="sm" aria-label="Chunk runs" mt="2">
                <Table.Header>
                  <Table.Row>
                    <Table.ColumnHeader>Chunk</Table.ColumnHeader>
                    <Table.ColumnHeader>Positions</Table.ColumnHeader>
                    <Table.ColumnHeader>Worker</Table.ColumnHeader>
                    <Table.ColumnHeader>Started</Table.ColumnHeader>
                    <Table.ColumnHeader>Finished</Table.ColumnHeader>
                  </Table.Row>
                </Table.Header>
                <Table.Body>
                  {runs.map((run, i) => (
                    <Table.Row key={i}>
                      <Table.Cell>{run.chunk}</Table.Cell>
                      <Table.Cell {...mono}>{`${run.start}–${run.end - 1}`}</Table.Cell>
                      <Table.Cell {...mono}>{run.worker}</Table.Cell>
                      <Table.Cell><DateTime iso={run.startedAt} /></Table.Cell>
                      <Table.Cell><DateTime iso={run.finishedAt} /></Table.Cell>
                    </Table.Row>
                  ))}
                </Table.Body>
              </Table.Root>
            </details>
          </>
        )}
        {children}
      </Stack>
    </Panel>
  );
}
