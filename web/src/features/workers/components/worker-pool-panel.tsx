import { Alert, chakra, Heading, SimpleGrid, Stack, Table, Text } from '@chakra-ui/react';
import type { WorkerPool } from '@sixtyfold/shared';
import { Panel } from '@/components/ui/panel';
import { workerSlots } from '../utils/worker-slots';

/** "just now", "12 s ago", "3 min ago": how fresh a heartbeat is, which is what matters here. */
export function seenAgo(iso: string, now: number): string {
  const seconds = Math.max(0, Math.round((now - new Date(iso).getTime()) / 1000));
  if (!Number.isFinite(seconds)) return iso;
  if (seconds < 2) return 'just now';
  if (seconds < 120) return `${seconds} s ago`;
  return `${Math.round(seconds / 60)} min ago`;
}

interface WorkerPoolPanelProps {
  pool: WorkerPool;
  /** The clock the heartbeats are compared with; the time of rendering unless a test fixes it. */
  now?: number;
}

export function WorkerPoolPanel({ pool, now = Date.now() }: WorkerPoolPanelProps) {
  const { workers, queue } = pool;
  const figures = [
    { label: 'Processes alive', value: workers.length },
    { label: 'Concurrency', value: workerSlots(pool) },
    { label: 'Chunks waiting', value: queue.waiting },
    { label: 'Chunks active', value: queue.active },
    { label: 'Chunks delayed', value: queue.delayed },
    { label: 'Chunks failed', value: queue.failed },
  ];

  return (
    <Panel as="section" aria-labelledby="worker-pool">
      <Stack gap="4" p="4">
        <Heading as="h2" size="md" id="worker-pool" color="ink.900">
          Worker pool
        </Heading>
        {workers.length === 0 && (
          <Alert.Root status="warning" variant="subtle" borderRadius="md">
            <Alert.Indicator />
            <Alert.Content>
              <Alert.Title>No workers alive: queued scans will wait</Alert.Title>
              <Alert.Description>Scans stay in the queue until a worker process starts. Your site administrator can start them.</Alert.Description>
            </Alert.Content>
          </Alert.Root>
        )}
        <SimpleGrid as="dl" columns={{ base: 2, sm: 3 }} gap="3">
          {figures.map((figure) => (
            <Stack key={figure.label} gap="0.5" px="3" py="2" bg="bg.subtle" borderRadius="md">
              <chakra.dt fontSize="xs" color="fg.muted">
                {figure.label}
              </chakra.dt>
              <chakra.dd fontFamily="mono" fontSize="lg" fontWeight="600" color={figure.label === 'Chunks failed' && figure.value > 0 ? 'fg.error' : 'ink.900'}>
                {figure.value.toLocaleString('en-US')}
              </chakra.dd>
            </Stack>
          ))}
        </SimpleGrid>
        <Text fontSize="xs" color="fg.muted">
          Concurrency is how many chunks of points the processes compute at once; the queue counts chunks, not scans.
        </Text>
      </Stack>
      {workers.length > 0 && (
        <Table.ScrollArea borderTopWidth="1px" borderColor="border.muted">
          <Table.Root size="sm" aria-label="Worker processes">
            <Table.Header>
              <Table.Row bg="bg.subtle">
                <Table.ColumnHeader>Process</Table.ColumnHeader>
                <Table.ColumnHeader textAlign="end">Points done</Table.ColumnHeader>
                <Table.ColumnHeader>Last seen</Table.ColumnHeader>
              </Table.Row>
            </Table.Header>
            <Table.Body>
              {workers.map((worker) => (
                <Table.Row key={worker.id}>
                  <Table.Cell>
                    <Text fontFamily="mono" fontSize="sm" wordBreak="break-all">
                      {worker.host}:{worker.pid}
                    </Text>
                    <Text fontSize="xs" color="fg.muted">
                      {worker.concurrency} {worker.concurrency === 1 ? 'slot' : 'slots'}
                    </Text>
                  </Table.Cell>
                  <Table.Cell textAlign="end" fontFamily="mono" fontSize="sm">
                    {worker.pointsDone.toLocaleString('en-US')}
                  </Table.Cell>
                  <Table.Cell fontSize="sm" color="fg.muted" whiteSpace="nowrap">
                    <chakra.time dateTime={worker.lastSeenAt} title={worker.lastSeenAt}>
                      {seenAgo(worker.lastSeenAt, now)}
                    </chakra.time>
                  </Table.Cell>
                </Table.Row>
              ))}
            </Table.Body>
          </Table.Root>
        </Table.ScrollArea>
      )}
    </Panel>
  );
}
