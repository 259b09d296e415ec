import { Button, CloseButton, DataList, Drawer, Portal, Stack, Text } from '@chakra-ui/react';
import type { ScanDetail, ScanGrid } from '@sixtyfold/shared';
import type { ReactNode } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { paths } from '@/config/paths';
import { ApiRequestError } from '@/lib/api-client';
import { isLive } from '../../api/get-scan';
import { useScanPoint } from '../../api/get-scan-point';
import { outputLabel } from '../../utils/output-labels';
import { failureLabel, formatValue, inputLabel } from '../../utils/point-columns';

const KEY_OUTPUTS = ['ns', 'r', 'alphaS', 'nStar'] as const;
const mono = { fontFamily: 'mono' } as const;

/** Where the point sits and what was stored for it: the few numbers a heatmap cell stands for. */
function PointNumbers({ scan, grid, pointIndex }: { scan: ScanDetail; grid: ScanGrid; pointIndex: number }) {
  const stored = useScanPoint(scan.id, pointIndex, { live: isLive(scan) });
  const inputs = grid.point(pointIndex);
  const point = stored.data;
  return (
    <DataList.Root orientation="horizontal" size="sm" gap="2" aria-label={`Point ${pointIndex} in numbers`}>
      {Object.entries(inputs).map(([name, value]) => (
        <DataList.Item key={name}>
          <DataList.ItemLabel>{inputLabel(name)}</DataList.ItemLabel>
          <DataList.ItemValue {...mono}>{formatValue(value)}</DataList.ItemValue>
        </DataList.Item>
      ))}
      <DataList.Item>
        <DataList.ItemLabel>Status</DataList.ItemLabel>
        <DataList.ItemValue {...mono}>
          {point
            ? point.status === 'ok'
              ? 'ok'
              : `${point.status}: ${failureLabel(point.status)}`
            : stored.isPending
              ? '…'
              : stored.error instanceof ApiRequestError && stored.error.status === 404
                ? 'not stored yet'
                : 'could not be loaded'}
        </DataList.ItemValue>
      </DataList.Item>
      {point?.status === 'ok' &&
        KEY_OUTPUTS.map((output) => (
          <DataList.Item key={output}>
            <DataList.ItemLabel>{outputLabel(output)}</DataList.ItemLabel>
            <DataList.ItemValue {...mono}>{formatValue(point[output])}</DataList.ItemValue>
          </DataList.Item>
        ))}
    </DataList.Root>
  );
}

interface PointDrawerProps {
  scan: ScanDetail;
  grid: ScanGrid;
  /** The open point; null closes the drawer. */
  pointIndex: number | null;
  /** How many comments the point has, when known. */
  commentCount?: number;
  onClose: () => void;
  /** Shown under the numbers: the point's discussion. */
  children?: ReactNode;
}

/** A clicked cell's point beside the heatmaps: its key numbers, a link to its page, and its discussion. */
export function PointDrawer({ scan, grid, pointIndex, commentCount, onClose, children }: PointDrawerProps) {
  const open = pointIndex !== null && pointIndex < grid.size;
  return (
    <Drawer.Root open={open} onOpenChange={(details) => !details.open && onClose()} size="md" placement="end">
      <Portal>
        <Drawer.Backdrop />
        <Drawer.Positioner>
          <Drawer.Content>
            {open && (
              <>
                <Drawer.Header>
                  <Drawer.Title>
                    Point {pointIndex.toLocaleString('en-US')}
                    {commentCount ? (
                      <Text as="span" color="fg.muted" fontWeight="normal" fontSize="sm" ms="2">
                        · {commentCount} {commentCount === 1 ? 'comment' : 'comments'}
                      </Text>
                    ) : null}
                  </Drawer.Title>
                </Drawer.Header>
                <Drawer.Body>
                  <Stack gap="5">
                    <PointNumbers scan={scan} grid={grid} pointIndex={pointIndex} />
                    <Button asChild size="sm" variant="outline" alignSelf="start">
                      <RouterLink to={paths.point.getHref(scan.id, pointIndex)}>Open point</RouterLink>
                    </Button>
                    {children}
                  </Stack>
                </Drawer.Body>
                <Drawer.CloseTrigger asChild>
                  <CloseButton size="sm" aria-label="Close the point" />
                </Drawer.CloseTrigger>
              </>
            )}
          </Drawer.Content>
        </Drawer.Positioner>
      </Portal>
    </Drawer.Root>
  );
}
