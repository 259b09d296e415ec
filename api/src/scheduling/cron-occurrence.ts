import type { CronJob } from 'cron';

/**
 * The scheduled time (ms since the epoch) that a tick of `job` at `now` belongs to: the first
 * occurrence after `now` minus half a period (at most a minute). A tick that fires late, or on a
 * machine whose clock is a little off, still names the same occurrence as every other process.
 */
export function cronOccurrence(job: CronJob, now = Date.now()): number {
  const [next, following] = job.nextDates(2).map((d) => d.toMillis());
  const slack = Math.min(60_000, (following - next) / 2);
  return job.cronTime.getNextDateFrom(new Date(now - slack)).toMillis();
}
