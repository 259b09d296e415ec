
/** Seconds as "42 s", "3 min 20 s" or "2 h 05 min": times left are estimates, so no more detail. */
export function formatSeconds(seconds: number): string {
  const s = Math.max(0, Math.round(seconds));
  if (s < 60) return `${s} s`;
  if (s < 3600) return `${Math.floor(s / 60)} min ${String(s % 60).padStart(2, '0')} s`;
  const minutes = Math.round(s / 60);
  return `${Math.floor(minutes / 60)} h ${String(minutes % 60).padStart(2, '0')} min`;
}

/** Points per second to three significant digits. */
export const formatRate = (perSecond: number) => `${Number(perSecond.toPrecision(3)).toLocaleString('en-US')} points/s`;
