import { Button, HStack, Stack, Text } from '@chakra-ui/react';
import type { CurrentUser, ScanDetail } from '@sixtyfold/shared';
import { useState } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { FailureAlert } from '@/components/ui/failure-alert';
import { paths } from '@/config/paths';
import { useCancelScan } from '../api/cancel-scan';
import { isLive } from '../api/get-scan';
import { useRetryScan } from '../api/retry-scan';
import { scanPermissions } from '../utils/scan-permissions';
import { DeleteScanDialog } from './delete-scan-dialog';

interface ScanActionsProps {
  scan: ScanDetail;
  user: CurrentUser | null | undefined;
  groupName: string;
  /** Called once the scan is deleted (the page then leaves). */
  onDeleted: () => void;
}

/** The actions the user may take on this scan now; the others are left out and the note says why. */
export function ScanActions({ scan, user, groupName, onDeleted }: ScanActionsProps) {
  const can = scanPermissions(scan, user);
  const cancel = useCancelScan();
  const retry = useRetryScan();
  const [confirmingDelete, setConfirmingDelete] = useState(false);

  const live = isLive(scan);
  const withheld = [
    !can.clone && 'start a new scan from it (members and leads)',
    live && !can.cancel && 'cancel it (its owner or a lead)',
    !live && scan.failedPoints > 0 && !can.retry && 'retry its failed points (its owner or a lead)',
    !can.remove && 'delete it (leads)',
  ].filter((text): text is string => Boolean(text));
  const failed = cancel.isError ? { title: 'Could not cancel the scan', error: cancel.error } : retry.isError ? { title: 'Could not retry the failed points', error: retry.error } : null;

  return (
    <Stack gap="2" align={{ base: 'stretch', md: 'end' }} maxW={{ md: 'md' }}>
      <HStack gap="2" wrap="wrap" justify={{ base: 'start', md: 'end' }}>
        {can.clone && (
          <Button asChild size="sm" variant="outline">
            <RouterLink to={paths.scanNew.getHref(scan.id)}>Clone scan</RouterLink>
          </Button>
        )}
        {can.retry && (
          <Button
            size="sm"
            variant="outline"
            loading={retry.isPending}
            loadingText="Queuing…"
            onClick={() => {
              cancel.reset();
              retry.mutate(scan.id);
            }}
          >
            Retry failed points
          </Button>
        )}
        {can.cancel && (
          <Button
            size="sm"
            variant="outline"
            colorPalette="red"
            loading={cancel.isPending}
            loadingText="Cancelling…"
            onClick={() => {
              retry.reset();
              cancel.mutate(scan.id);
            }}
          >
            Cancel scan
          </Button>
        )}
        {can.remove && (
          <Button size="sm" variant="solid" colorPalette="red" onClick={() => setConfirmingDelete(true)}>
            Delete scan
          </Button>
        )}
      </HStack>
      {withheld.length > 0 && (
        <Text fontSize="xs" color="fg.muted" textAlign={{ md: 'end' }}>
          {can.role ? `As a ${can.role} of ${groupName}` : `Outside ${groupName}`} you cannot {withheld.join('; ')}.
        </Text>
      )}
      {failed && (
        <FailureAlert title={failed.title} size="sm">{failed.error.message}</FailureAlert>
      )}
      <DeleteScanDialog scan={confirmingDelete ? scan : null} onClose={() => setConfirmingDelete(false)} onDeleted={onDeleted} />
    </Stack>
  );
}
