import { Badge, Tabs } from '@chakra-ui/react';
import type { ScanDetail, StoredScanSpec } from '@sixtyfold/shared';
import type { ReactNode } from 'react';
import { ScanConstraintsView } from './constraints/scan-constraints-view';
import { useViewParams } from '../hooks/use-view-params';
import type { PointDiscussion } from './heatmaps/point-drawer';
import { ScanHeatmaps } from './heatmaps/scan-heatmaps';
import { ScanLinePlots } from './heatmaps/scan-line-plots';
import type { UseRegionOverlay } from './plane/region-overlay';
import { ScanPlaneView } from './plane/scan-plane-view';
import { ScanPointsTable } from './points-table';
import { ScanProvenancePanel } from './scan-provenance-panel';

export const SCAN_VIEWS = ['heatmaps', 'plane', 'points', 'constraints', 'discussion', 'computed'] as const;
export type ScanView = (typeof SCAN_VIEWS)[number];

/** The view in the address (`?view=`), heatmaps when there is none or it is unknown. */
export const readScanView = (value: string | null): ScanView => ((SCAN_VIEWS as readonly string[]).includes(value ?? '') ? (value as ScanView) : 'heatmaps');

/**
 * The scan's results as tabs. Only the open tab is mounted, so a live scan polls only for what is
 * on screen; each view keeps its settings in the address, so coming back finds them. A scan over
 * a list of points has no grid to draw heatmaps of: it opens on the plane.
 */
interface ScanViewsProps {
  scan: ScanDetail;
  spec: StoredScanSpec;
  /** The scan's own discussion as a tab, with its comment count when known; composed in by the page. */
  discussion?: { content: ReactNode; count?: number };
  /** Each point's discussion, in the drawer a clicked cell or line point opens. */
  pointDiscussion?: PointDiscussion;
  /** The constraint regions drawn on the plane; composed in by the page. */
  useRegionOverlay: UseRegionOverlay;
  /** May the user start a reproducibility check (the member role)? */
  canCheckReproducibility?: boolean;
}

export function ScanViews({ scan, spec, discussion, pointDiscussion, useRegionOverlay, canCheckReproducibility = false }: ScanViewsProps) {
  const [params, update] = useViewParams();
  const first: ScanView = spec.axes ? 'heatmaps' : 'plane';
  const asked = params.get('view') === null ? first : readScanView(params.get('view'));
  // A list scan has no heatmaps, and the discussion tab needs its thread.
  const view = (!spec.axes && asked === 'heatmaps') || (asked === 'discussion' && !discussion) ? first : asked;
  const oneAxis = spec.axes?.length === 1;
  return (
    <Tabs.Root
      value={view}
      onValueChange={(details) => update({ view: details.value === first ? null : details.value })}
      lazyMount
      unmountOnExit
      colorPalette="ember"
      variant="line"
    >
      <Tabs.List aria-label="Scan results">
        {spec.axes && <Tabs.Trigger value="heatmaps">{oneAxis ? 'Line plots' : 'Heatmaps'}</Tabs.Trigger>}
        <Tabs.Trigger value="plane">n_s–r plane</Tabs.Trigger>
        <Tabs.Trigger value="points">Points</Tabs.Trigger>
        <Tabs.Trigger value="constraints">Constraints</Tabs.Trigger>
        {discussion && (
          <Tabs.Trigger value="discussion">
            Discussion
            {discussion.count ? (
              <Badge size="sm" variant="subtle" colorPalette="gray" aria-label={`${discussion.count} ${discussion.count === 1 ? 'comment' : 'comments'}`}>
                {discussion.count}
              </Badge>
            ) : null}
          </Tabs.Trigger>
        )}
        <Tabs.Trigger value="computed">How this was computed</Tabs.Trigger>
      </Tabs.List>
      {spec.axes && (
        <Tabs.Content value="heatmaps">
          {oneAxis ? <ScanLinePlots scan={scan} spec={spec} pointDiscussion={pointDiscussion} /> : <ScanHeatmaps scan={scan} spec={spec} pointDiscussion={pointDiscussion} />}
        </Tabs.Content>
      )}
      <Tabs.Content value="plane">
        <ScanPlaneView scan={scan} spec={spec} useRegionOverlay={useRegionOverlay} />
      </Tabs.Content>
      <Tabs.Content value="points">
        <ScanPointsTable scan={scan} />
      </Tabs.Content>
      <Tabs.Content value="constraints">
        <ScanConstraintsView scan={scan} spec={spec} />
      </Tabs.Content>
      {discussion && <Tabs.Content value="discussion">{discussion.content}</Tabs.Content>}
      <Tabs.Content value="computed">
        <ScanProvenancePanel scanId={scan.id} canCheckReproducibility={canCheckReproducibility} />
      </Tabs.Content>
    </Tabs.Root>
  );
}
