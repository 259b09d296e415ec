import { Link, Text } from '@chakra-ui/react';
import { Pager } from '@/components/ui/pager';

interface PointsPageFooterProps {
  /** The last refresh's error, if it failed while an older page is still shown. */
  error: Error | null;
  onRetry: () => void;
  page: number;
  pageSize: number;
  total: number;
  /** An older page is shown while the next loads. */
  busy: boolean;
  onPageChange: (page: number) => void;
}

/** Under a points table: a failed refresh (the last page stays) and the pager. */
export function PointsPageFooter({ error, onRetry, page, pageSize, total, busy, onPageChange }: PointsPageFooterProps) {
  return (
    <>
      {error && (
        <Text mt="2" fontSize="sm" color="fg.error">
          Could not refresh the points ({error.message}); showing the last page.{' '}
          <Link as="button" onClick={onRetry}>
            Try again
          </Link>
        </Text>
      )}
      <Pager page={page} pageSize={pageSize} total={total} noun="points" busy={busy} onPageChange={onPageChange} />
    </>
  );
}
