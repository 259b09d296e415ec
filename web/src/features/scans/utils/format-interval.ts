import type { ScanConstraints } from '@sixtyfold/shared';
import { formatNumber } from '@/lib/format-number';

type Interval = ScanConstraints['constraints'][number]['intervals'][number];

/** Three significant digits: what a quoted constraint carries. */
const short = (value: number) => formatNumber(value, 3, 'power');

/** "0.028 – 2.28" for a two-sided interval, "< 0.863" for an upper limit, "> 58.3" for a lower limit. */
export function formatInterval(interval: Interval): string {
  if (interval.kind === 'upper-limit') return `< ${short(interval.upper)}`;
  if (interval.kind === 'lower-limit') return `> ${short(interval.lower)}`;
  return `${short(interval.lower)} – ${short(interval.upper)}`;
}
