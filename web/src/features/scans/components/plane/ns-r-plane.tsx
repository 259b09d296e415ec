import { Stack, Text } from '@chakra-ui/react';
import { ENGINE_PIVOT_PER_MPC, type ConstraintRegion, type LikelihoodSetEntry } from '@sixtyfold/shared';
import { useMemo } from 'react';
import { Plot } from '@/components/plots/plot';
import { DRAWN_LEVELS, planeFigure, type PlaneSeries } from '../../utils/plane-figure';
import { LikelihoodSetNote } from '../likelihood-set-note';

export interface NsRPlaneProps {
  /** One scan, or 2 to 4 overlaid; each labelled in the legend. */
  series: PlaneSeries[];
  /** With one series: colour its points by this axis parameter or 'nStar'. */
  colorBy?: string | null;
  /** The likelihood sets whose 68 and 95 % regions lie under the points, each with its statement and sources below. */
  likelihoods: LikelihoodSetEntry[];
  rScale?: 'linear' | 'log';
  /** Draw the φ^p and α-attractor lines at N_* = 50 and 60. */
  references?: boolean;
  /** Uploaded constraint regions to outline. */
  regions?: ConstraintRegion[];
  /** A click on a scan's point: which series, and the point's index in that scan. */
  onPointClick?: (point: { series: number; pointIndex: number }) => void;
  height?: number;
}

/** OK points of one or more scans on the n_s–r plane, over the likelihood sets' regions, with their sources. */
export function NsRPlane({ series, colorBy, likelihoods, rScale = 'linear', references = true, regions, onPointClick, height = 480 }: NsRPlaneProps) {
  const figure = useMemo(
    () => planeFigure({ series, colorBy, likelihoods, rScale, references, regions }),
    [series, colorBy, likelihoods, rScale, references, regions],
  );
  const sampled = series.filter((s) => s.plane.stride > 1);
  const n = (value: number) => value.toLocaleString('en-US');

  return (
    <Stack gap="2">
      <Plot
        data={figure.data}
        layout={figure.layout}
        height={height}
        label={`n_s–r plane of ${series.map((s) => s.label).join(', ')}${likelihoods.length ? ` with the regions of ${likelihoods.map((set) => set.name).join(' and ')}` : ''}`}
        onPointClick={
          onPointClick
            ? (point) => {
                const data = point.customdata;
                if (Array.isArray(data) && typeof data[0] === 'number' && typeof data[1] === 'number') onPointClick({ series: data[0], pointIndex: data[1] });
              }
            : undefined
        }
      />
      <Stack gap="1" fontSize="xs" color="fg.muted">
        {sampled.map((s) => (
          <Text key={s.label} color="fg.warning">
            {s.label}: sampled evenly, 1 in {n(s.plane.stride)} of its points (steps of {s.plane.axisStrides.join(' × ')} along{' '}
            {s.plane.axisStrides.length === s.plane.parameters.length ? s.plane.parameters.join(' × ') : 'the list'}): {n(s.plane.ns.length)} of its{' '}
            {n(s.plane.okPoints)} ok points shown.
          </Text>
        ))}
        {likelihoods.length > 0 && (
          <Text>
            Shaded: the joint (n_s, r) regions of {likelihoods.length > 1 ? 'each set' : 'the set'}, Δχ² ≤ {DRAWN_LEVELS.map((d) => `${d.deltaChi2.toFixed(2)} (${d.percent})`).join(' and ')}{' '}
            for two parameters, with r at k = {ENGINE_PIVOT_PER_MPC} Mpc⁻¹ as the scans compute it.
          </Text>
        )}
        {likelihoods.map((set) => (
          <LikelihoodSetNote key={`${set.key}@${set.version}`} likelihood={set} named />
        ))}
        {regions && regions.length > 0 && (
          <Text>Outlines: constraint regions your group uploaded, as given in their files (name, confidence level, source in the legend).</Text>
        )}
        {references && (
          <Text>
            Lines: first-order slow-roll predictions of V ∝ φ^p (Liddle &amp; Lyth 2000) and of α-attractors, n_s = 1 − 2/N_*, r = 12α/N_*²
            (Kallosh, Linde &amp; Roest 2013, arXiv:1311.0472), at N_* = 50 (dotted) and 60 (dashed).
          </Text>
        )}
      </Stack>
    </Stack>
  );
}
