import type { ScanProgress } from '@sixtyfold/shared';

export interface ScanPace {
  /** Points finished (done or failed) per second since the scan started; null until one has finished. */
  pointsPerSecond: number | null;
  /** The API's estimate from that rate; null until there is one. */
  remainingSeconds: number | null;
}

/** How fast a running scan goes, from its detail's progress. */
export function scanPace(progress: ScanProgress): ScanPace {
  const finished = progress.done + progress.failed;
  const elapsed = progress.elapsedSeconds;
  return {
    pointsPerSecond: elapsed && elapsed > 0 && finished > 0 ? finished / elapsed : null,
    remainingSeconds: progress.remainingSeconds,
  };
}
