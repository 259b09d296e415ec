import type { BuildInfo } from '@sixtyfold/shared';

/** How today's build differs from the one a scan was computed with, in words; null when they agree on engine and commit. */
export function buildDifference(scan: BuildInfo | null, today: BuildInfo): string | null {
  if (!scan) return 'The engine this scan was computed with was not recorded, so a difference below may come from a change of engine.';
  const parts: string[] = [];
  if (scan.engineVersion !== today.engineVersion) parts.push(`engine ${today.engineVersion} (the scan's: ${scan.engineVersion})`);
  if (scan.commit !== today.commit) parts.push(`commit ${short(today.commit)} (the scan's: ${short(scan.commit)})`);
  if (parts.length === 0) return null;
  return `Today's build differs from the one this scan was computed with: ${parts.join(', ')}. Differences below may come from that change.`;
}

const short = (commit: string) => (/^[0-9a-f]{40}$/.test(commit) ? commit.slice(0, 12) : commit);
