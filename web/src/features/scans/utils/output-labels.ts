import type { PointOutput } from '@sixtyfold/shared';
import { OUTPUT_LABELS } from './point-columns';

/** Outputs that span decades; colour scales and axes show them by log₁₀. */
export const LOG_OUTPUTS: ReadonlySet<PointOutput | 'status'> = new Set(['As', 'amplitudeScale', 'energyScaleGeV']);

/** An output's on-screen name, including the status a heatmap can be coloured by. */
export const outputLabel = (output: PointOutput | 'status') => (output === 'status' ? 'Status' : OUTPUT_LABELS[output]);
