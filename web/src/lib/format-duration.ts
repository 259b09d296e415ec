/**
 * A rough duration for people, e.g. "about 4 min": estimates and times left are not precise,
 * so the wording says so and the figure is rounded to what matters at its scale.
 */
export function formatDuration(seconds: number): string {
  if (!Number.isFinite(seconds) || seconds < 0) return 'unknown';
  if (seconds < 10) return 'a few seconds';
  const s = Math.round(seconds / 5) * 5;
  if (s < 60) return `about ${s} s`;
  const minutes = Math.round(seconds / 60);
  if (minutes < 60) return `about ${minutes} min`;
  // Past an hour, tens of minutes are precise enough; past a day, hours.
  const tens = Math.round(seconds / 600) * 10;
  if (tens < 24 * 60) return join(Math.floor(tens / 60), 'h', tens % 60, 'min');
  const hours = Math.round(seconds / 3_600);
  return join(Math.floor(hours / 24), 'd', hours % 24, 'h');
}

const join = (big: number, bigUnit: string, small: number, smallUnit: string) =>
  small ? `about ${big} ${bigUnit} ${small} ${smallUnit}` : `about ${big} ${bigUnit}`;

/** A rate to three significant figures, e.g. "12.3 points/s". */
export function formatRate(perSecond: number, unit = 'points'): string {
  const value = perSecond >= 100 ? Math.round(perSecond).toLocaleString('en-US') : Number(perSecond.toPrecision(3)).toString();
  return `${value} ${unit}/s`;
}
