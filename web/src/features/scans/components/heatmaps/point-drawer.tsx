import { Button, CloseButton, DataList, Drawer, Portal, Stack, Text } from '@chakra-ui/react';
import type { ScanDetail, ScanGrid } from '@sixtyfold/shared';
import type { ReactNode } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { paths } from '@/config/paths';
import { ApiRequestError } from '@/lib/api-client';
import { formatNumber } from '@/lib/format-number';
import { isLive } from '../../api/get-scan';
import { useScanPoint } from '../../api/get-scan-point';
import { useViewParams } from '../../hooks/use-view-params';
import { outputLabel } from '../../utils/output-labels';
import { failureLabel, inputLabel } from '@/lib/point-labels';

/** A point's discussion, composed in by the page: comment counts by point index, and the thread itself. */
export interface PointDiscussion {
  counts?: Record<string, number>;
  render: (pointIndex: number) => ReactNode;
}

/**
 * The point open in the drawer, kept in the address as `point`, so a reload or a shared link opens
 * it again; null when none (or one outside the grid) is open.
 */
export function useOpenPoint(size: number): [number | null, (pointIndex: number | null) => void] {
  const [params, update] = useViewParams();
  const raw = params.get('point');
  const open = raw !== null && /^\d+$/.test(raw) && Number(raw) < size ? Number(raw) : null;
  return [open, (pointIndex) => update({ point: pointIndex === null ? null : String(pointIndex) })];
}

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
          <DataList.ItemValue {...mono}>{formatNumber(value)}</DataList.ItemValue>
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
            <DataList.ItemValue {...mono}>{formatNumber(point[output])}</DataList.ItemValue>
          </DataList.Item>
        ))}
    </DataList.Root>
  );
}

interface PointDrawerProps {
  scan: ScanDetail;
  grid: ScanGrid;
  /** Shown under the numbers, with the point's comment count in the title. */
  pointDiscussion?: PointDiscussion;
}

/** The point open in the address beside the plots: its key numbers, a link to its page, and its discussion. */
export function PointDrawer({ scan, grid, pointDiscussion }: PointDrawerProps) {
  const [pointIndex, setPoint] = useOpenPoint(grid.size);
  const open = pointIndex !== null;
  const commentCount = open ? pointDiscussion?.counts?.[String(pointIndex)] : undefined;
  const onClose = () => setPoint(null);
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
                    {pointDiscussion?.render(pointIndex)}
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
