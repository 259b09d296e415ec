import { Alert, Badge, Box, Button, Heading, HStack, Stack, Text } from '@chakra-ui/react';
import { useSearchParams } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { CompareIcon } from '@/components/ui/icons';
import { LoadingState } from '@/components/ui/loading-state';
import { PageHeader } from '@/components/ui/page-header';
import { Panel } from '@/components/ui/panel';
import { useMe } from '@/features/auth/api/get-me';
import { useScans } from '@/features/scans/api/get-scans';
import { useRegionOverlay } from '@/features/constraint-regions/hooks/use-region-overlay';
import { ComparePlots } from '@/features/scans/components/compare/compare-plots';
import { ScanComparison } from '@/features/scans/components/scan-comparison';
import { ScanPicker } from '@/features/scans/components/scan-picker';
import { formatScanIds, MAX_COMPARED_SCANS, parseScanIds } from '@/features/scans/utils/scan-ids-param';
import { useDocumentTitle } from '@/hooks/use-document-title';
import { groupNamesOf } from '@/lib/group-names';

// One generous page; the picker only needs the completed ones.
const PICKER_PAGE_SIZE = 100;

export function CompareRoute() {
  useDocumentTitle('Compare');
  const [params, setParams] = useSearchParams();
  const selected = parseScanIds(params.get('scans'));
  const { data: user } = useMe();
  const scans = useScans({ page: 1, pageSize: PICKER_PAGE_SIZE });
  const groupNames = groupNamesOf(user);

  const setSelected = (ids: number[]) =>
    setParams(
      (current) => {
        const copy = new URLSearchParams(current);
        if (ids.length) copy.set('scans', formatScanIds(ids));
        else copy.delete('scans');
        return copy;
      },
      { replace: true },
    );

  const completed = scans.data?.items.filter((scan) => scan.status === 'completed') ?? [];
  const chosen = selected.flatMap((id) => completed.filter((scan) => scan.id === id));
  const missing = scans.data ? selected.filter((id) => !completed.some((scan) => scan.id === id)) : [];

  return (
    <Stack gap="0">
      <PageHeader
        title="Compare"
        description={`Pick 2 to ${MAX_COMPARED_SCANS} completed scans to compare them side by side. The selection is kept in the address, so you can share or bookmark it.`}
      />
      {scans.isPending ? (
        <LoadingState label="Loading completed scans…" />
      ) : scans.isError ? (
        <ErrorState title="Could not load scans to compare" error={scans.error} onRetry={() => scans.refetch()} />
      ) : completed.length === 0 ? (
        <EmptyState
          icon={<CompareIcon />}
          title="No completed scans yet"
          description="Only scans that have finished can be compared. Once a scan in one of your groups completes, it appears here."
        />
      ) : (
        <Stack gap="6">
          {missing.length > 0 && (
            <Alert.Root status="warning" variant="subtle" borderRadius="md">
              <Alert.Indicator />
              <Alert.Content>
                <Alert.Title>
                  {missing.length === 1 ? `Scan ${missing[0]} is` : `Scans ${missing.join(', ')} are`} not among your
                  completed scans
                </Alert.Title>
                <Alert.Description>
                  It may still be running, belong to a group you are not in, or no longer exist. Untick it or pick another.
                </Alert.Description>
              </Alert.Content>
              <Button size="xs" variant="outline" alignSelf="center" onClick={() => setSelected(chosen.map((s) => s.id))}>
                Remove
              </Button>
            </Alert.Root>
          )}
          <Panel>
            <HStack justify="space-between" px="4" py="3" borderBottomWidth="1px" borderColor="border.muted" gap="3" wrap="wrap">
              <Heading as="h2" size="sm" color="ink.900">
                Completed scans
              </Heading>
              <HStack gap="3">
                <Badge colorPalette={chosen.length >= 2 ? 'ember' : 'gray'} variant="subtle" aria-live="polite">
                  {chosen.length} of {MAX_COMPARED_SCANS} picked
                </Badge>
                {selected.length > 0 && (
                  <Button size="xs" variant="ghost" onClick={() => setSelected([])}>
                    Clear
                  </Button>
                )}
              </HStack>
            </HStack>
            <ScanPicker scans={completed} selected={selected} onChange={setSelected} groupNames={groupNames} />
            {scans.data.total > scans.data.items.length && (
              <Text px="4" py="3" fontSize="sm" color="fg.muted" borderTopWidth="1px" borderColor="border.muted">
                Listing the completed scans among the first {scans.data.items.length} of your {scans.data.total} scans.
              </Text>
            )}
          </Panel>
          <Box>
            <Heading as="h2" size="md" color="ink.900" mb="3">
              Side by side
            </Heading>
            {chosen.length < 2 ? (
              <Text color="fg.muted">
                {chosen.length === 0 ? 'Pick at least two scans above.' : 'Pick one more scan to see them side by side.'}
              </Text>
            ) : (
              <Stack gap="6">
                <Panel>
                  <ScanComparison scans={chosen} groupNames={groupNames} />
                </Panel>
                <ComparePlots scanIds={chosen.map((scan) => scan.id)} useRegionOverlay={useRegionOverlay} />
              </Stack>
            )}
          </Box>
        </Stack>
      )}
    </Stack>
  );
}
