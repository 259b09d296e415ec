import { Stack, Text } from '@chakra-ui/react';
import { variedInputs, type ScanDetail, type StoredScanSpec } from '@sixtyfold/shared';
import { useMemo } from 'react';
import { useNavigate } from 'react-router-dom';
import { AppLink } from '@/components/ui/app-link';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { CurveIcon } from '@/components/ui/icons';
import { LoadingState } from '@/components/ui/loading-state';
import { Panel } from '@/components/ui/panel';
import { paths } from '@/config/paths';
import { isLive } from '../../api/get-scan';
import { useScanPlane } from '../../api/get-scan-plane';
import { DEFAULT_LIKELIHOOD } from '../../api/get-likelihood-sets';
import { useChosenLikelihoods } from '../../hooks/use-chosen-likelihoods';
import { useViewParams } from '../../hooks/use-view-params';
import { LikelihoodSetSelect } from '../likelihood-set-picker';
import { NsRPlane } from './ns-r-plane';
import { PlaneControls, type PlaneSettings } from './plane-controls';
import type { UseRegionOverlay } from './region-overlay';

/** The scan's ok points on the n_s–r plane, with the settings kept in the address. */
export function ScanPlaneView({ scan, spec, useRegionOverlay }: { scan: ScanDetail; spec: StoredScanSpec; useRegionOverlay: UseRegionOverlay }) {
  const navigate = useNavigate();
  const live = isLive(scan);
  const plane = useScanPlane(scan.id, { live });
  const [params, update] = useViewParams();
  const regions = useRegionOverlay([scan.groupId]);
  const likelihoods = useChosenLikelihoods([DEFAULT_LIKELIHOOD]);

  const axes = variedInputs(spec);
  const colorOptions = [...(axes.includes('nStar') ? axes : [...axes, 'nStar']), 'deltaChi2'];
  const colorParam = params.get('color');
  const settings: PlaneSettings = {
    colorBy: colorParam && colorOptions.includes(colorParam) ? colorParam : colorOptions[0],
    rScale: params.get('rscale') === 'log' ? 'log' : 'linear',
    references: params.get('refs') !== 'off',
  };
  const onChange = (changes: Partial<PlaneSettings>) =>
    update({
      ...(changes.colorBy !== undefined && { color: changes.colorBy }),
      ...(changes.rScale !== undefined && { rscale: changes.rScale === 'log' ? 'log' : null }),
      ...(changes.references !== undefined && { refs: changes.references ? null : 'off' }),
    });
  const series = useMemo(() => (plane.data ? [{ label: scan.name, plane: plane.data }] : []), [plane.data, scan.name]);

  return (
    <Stack gap="4">
      <Panel p={{ base: '3', md: '4' }}>
        <PlaneControls settings={settings} onChange={onChange} colorOptions={colorOptions}>
          <LikelihoodSetSelect choice={likelihoods} />
        </PlaneControls>
        {regions.toggles && <Stack mt="3">{regions.toggles}</Stack>}
        <Text fontSize="xs" color="fg.muted" mt="3">
          Members upload the group’s constraint regions on the <AppLink to={paths.group.getHref(scan.groupId)}>group page</AppLink>.
        </Text>
      </Panel>
      {plane.isPending ? (
        <LoadingState label="Loading the n_s–r plane…" />
      ) : plane.isError && !plane.data ? (
        <ErrorState title="Could not load the n_s–r plane" error={plane.error} onRetry={() => plane.refetch()} />
      ) : plane.data.okPoints === 0 ? (
        <EmptyState
          icon={<CurveIcon />}
          title="No ok points yet"
          description={
            live
              ? 'Points appear here as workers store them; this view refreshes by itself.'
              : 'None of the points of this scan produced n_s and r. The heatmaps and the points table show why they failed.'
          }
        />
      ) : (
        <Panel p={{ base: '3', md: '4' }}>
          {plane.isError && (
            <Text fontSize="xs" color="fg.error" mb="2">
              Could not refresh the plane: {plane.error.message}
            </Text>
          )}
          <NsRPlane
            series={series}
            colorBy={settings.colorBy}
            likelihoods={likelihoods.sets}
            rScale={settings.rScale}
            references={settings.references}
            regions={regions.shown}
            onPointClick={({ pointIndex }) => navigate(paths.point.getHref(scan.id, pointIndex))}
          />
          <Text fontSize="xs" color="fg.muted" mt="1">
            {plane.data.okPoints.toLocaleString('en-US')} ok points{live ? ' so far' : ''}. Click a point to open it.
          </Text>
        </Panel>
      )}
    </Stack>
  );
}
