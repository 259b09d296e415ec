import { Heading, Stack, Text } from '@chakra-ui/react';
import type { ConstraintRegion, CurrentUser } from '@sixtyfold/shared';
import { useState } from 'react';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { useConstraintRegions } from '../api/get-constraint-regions';
import { regionPermissions } from '../utils/region-permissions';
import { ConstraintRegionsTable } from './constraint-regions-table';
import { DeleteRegionDialog } from './delete-region-dialog';
import { RegionUploadForm } from './region-upload-form';

interface GroupConstraintRegionsProps {
  groupId: number;
  groupName: string;
  user: CurrentUser | null | undefined;
}

/** A group's uploaded constraint regions (drawn on its scans' n_s–r planes), with upload and delete. */
export function GroupConstraintRegions({ groupId, groupName, user }: GroupConstraintRegionsProps) {
  const regions = useConstraintRegions(groupId);
  const can = regionPermissions(groupId, user);
  const [removing, setRemoving] = useState<ConstraintRegion | null>(null);

  return (
    <Stack gap="0">
      <Text px="4" pb="3" fontSize="sm" color="fg.muted">
        Outlines from papers or data releases, drawn over the n_s–r plane of every scan in this group, each with its own switch.
      </Text>
      {regions.isPending ? (
        <LoadingState label="Loading constraint regions…" />
      ) : regions.isError ? (
        <Stack px="4">
          <ErrorState title="Could not load the constraint regions" error={regions.error} onRetry={() => regions.refetch()} />
        </Stack>
      ) : regions.data.length === 0 ? (
        <Text px="4" pb="4" color="fg.muted">
          No constraint regions yet.
        </Text>
      ) : (
        <ConstraintRegionsTable regions={regions.data} canRemove={can.remove} onRemove={setRemoving} />
      )}
      {can.upload && (
        <Stack px="4" py="4" gap="3" borderTopWidth="1px" borderColor="border.muted">
          <Heading as="h3" size="xs" color="ink.900">
            Upload a region
          </Heading>
          <RegionUploadForm groupId={groupId} />
        </Stack>
      )}
      <DeleteRegionDialog region={removing} groupName={groupName} onClose={() => setRemoving(null)} />
    </Stack>
  );
}
