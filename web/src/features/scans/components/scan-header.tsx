import { Badge, DataList, Heading, HStack, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { findFamily, type PotentialModel, type ScanDetail, type StoredScanSpec } from '@sixtyfold/shared';
import type { ReactNode } from 'react';
import { AppLink } from '@/components/ui/app-link';
import { DateTime } from '@/components/ui/date-time';
import { PageHeader } from '@/components/ui/page-header';
import { Panel } from '@/components/ui/panel';
import { paths } from '@/config/paths';
import { ScanLiveProgress } from './scan-live-progress';
import { ScanSettings } from './scan-settings';
import { ScanStatusBadge } from './scan-status-badge';

interface ScanHeaderProps {
  scan: ScanDetail;
  spec: StoredScanSpec;
  groupName: string;
  /** The group model the scan ran with, as far as it has loaded (the page loads it through the models feature). */
  model: GroupModel;
  actions?: ReactNode;
}

export interface GroupModel {
  data?: PotentialModel;
  error: Error | null;
}

function ModelName({ spec, model }: { spec: StoredScanSpec; model: GroupModel }) {
  if (spec.model.kind === 'family') {
    const family = findFamily(spec.model.family);
    return (
      <AppLink to={paths.family.getHref(spec.model.family)} color="ink.fg">
        {family?.name ?? spec.model.family}
      </AppLink>
    );
  }
  const label = model.data?.name ?? (model.error ? `Model ${spec.model.modelId} (${model.error.message})` : `Model ${spec.model.modelId}`);
  return (
    <AppLink to={paths.model.getHref(spec.model.modelId)} color="ink.fg">
      {label}
    </AppLink>
  );
}

function SectionTitle({ id, children }: { id: string; children: ReactNode }) {
  return (
    <Heading as="h2" id={id} size="sm" color="ink.900" mb="3">
      {children}
    </Heading>
  );
}

/** Who ran what, how it was set up and how far it has got. */
export function ScanHeader({ scan, spec, groupName, model, actions }: ScanHeaderProps) {
  return (
    <Stack gap="4" mb="6">
      <PageHeader
        title={scan.name}
        description={
          <HStack as="span" gap="2" wrap="wrap">
            <ScanStatusBadge status={scan.status} />
            <Text as="span">
              Scan {scan.id} by {scan.ownerName} in{' '}
              <AppLink to={paths.group.getHref(scan.groupId)} color="ink.fg">
                {groupName}
              </AppLink>
            </Text>
          </HStack>
        }
        actions={actions}
      />
      <SimpleGrid columns={{ base: 1, lg: 2 }} gap="4">
        <Panel as="section" aria-labelledby="scan-about" p={{ base: '4', md: '5' }}>
          <SectionTitle id="scan-about">About</SectionTitle>
          <DataList.Root orientation="horizontal" size="sm" gap="2.5">
            <DataList.Item>
              <DataList.ItemLabel>Model</DataList.ItemLabel>
              <DataList.ItemValue>
                <ModelName spec={spec} model={model} />
              </DataList.ItemValue>
            </DataList.Item>
            <DataList.Item>
              <DataList.ItemLabel>Owner</DataList.ItemLabel>
              <DataList.ItemValue>{scan.ownerName}</DataList.ItemValue>
            </DataList.Item>
            <DataList.Item>
              <DataList.ItemLabel>Created</DataList.ItemLabel>
              <DataList.ItemValue>
                <DateTime iso={scan.createdAt} />
              </DataList.ItemValue>
            </DataList.Item>
            <DataList.Item>
              <DataList.ItemLabel>Started</DataList.ItemLabel>
              <DataList.ItemValue>
                <DateTime iso={scan.startedAt} />
              </DataList.ItemValue>
            </DataList.Item>
            <DataList.Item>
              <DataList.ItemLabel>Finished</DataList.ItemLabel>
              <DataList.ItemValue>
                <DateTime iso={scan.finishedAt} />
              </DataList.ItemValue>
            </DataList.Item>
            <DataList.Item>
              <DataList.ItemLabel>Tags</DataList.ItemLabel>
              <DataList.ItemValue>
                {scan.tags.length === 0 ? (
                  <Text color="fg.subtle">none</Text>
                ) : (
                  <HStack gap="1" wrap="wrap">
                    {scan.tags.map((tag) => (
                      <Badge key={tag} size="sm" variant="outline" colorPalette="gray" fontWeight="400">
                        {tag}
                      </Badge>
                    ))}
                  </HStack>
                )}
              </DataList.ItemValue>
            </DataList.Item>
            <DataList.Item alignItems="start">
              <DataList.ItemLabel>Note</DataList.ItemLabel>
              <DataList.ItemValue>
                {scan.note ? <Text whiteSpace="pre-wrap">{scan.note}</Text> : <Text color="fg.subtle">none</Text>}
              </DataList.ItemValue>
            </DataList.Item>
          </DataList.Root>
        </Panel>
        <Panel as="section" aria-labelledby="scan-settings" p={{ base: '4', md: '5' }}>
          <SectionTitle id="scan-settings">Settings</SectionTitle>
          <ScanSettings spec={spec} />
        </Panel>
      </SimpleGrid>
      {scan.status !== 'draft' && (
        <Panel as="section" aria-labelledby="scan-progress" p={{ base: '4', md: '5' }}>
          <SectionTitle id="scan-progress">Progress</SectionTitle>
          <ScanLiveProgress scan={scan} />
        </Panel>
      )}
    </Stack>
  );
}
