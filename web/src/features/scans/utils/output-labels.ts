import type { PointOutput } from '@sixtyfold/shared';
import { OUTPUT_LABELS } from '@/lib/point-labels';

/** Outputs that span decades; colour scales and axes show them by log₁₀. */
export const LOG_OUTPUTS: ReadonlySet<PointOutput | 'status' | 'deltaChi2'> = new Set(['As', 'amplitudeScale', 'energyScaleGeV']);

/** An output's on-screen name, including the status and the Δχ² under a likelihood set a heatmap can be coloured by. */
export const outputLabel = (output: PointOutput | 'status' | 'deltaChi2') =>
  output === 'status' ? 'Status' : output === 'deltaChi2' ? 'Δχ²' : OUTPUT_LABELS[output];
