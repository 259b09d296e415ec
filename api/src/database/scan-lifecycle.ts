import type { EntityManager } from 'typeorm';
import { SCAN_STATUSES, type ScanStatus } from '@sixtyfold/shared';
import { Scan } from '../scans/entities/scan.entity';

/**
 * The one owner of a scan's status and point counters (`status`, `done_points`, `failed_points`):
 * every change goes through a function here, and each is a row of SCAN_TRANSITIONS, which says
 * from which statuses, to which, and who may. The API and the worker both use it; nothing else
 * writes those columns. Changes that race (a chunk stored while the scan is cancelled) are
 * conditional updates whose WHERE clause is the transition's `from`, so the table decides them
 * in SQL too.
 */

/** Who changes a scan: group roles through the API, and the machinery. */
export type ScanActor = 'member' | 'owner or lead' | 'lead' | 'worker' | 'reconciler' | 'maintenance';

export type ScanEvent = 'submit' | 'draft' | 'start' | 'store' | 'finish' | 'cancel' | 'reopen' | 'delete';

export interface ScanTransition {
  event: ScanEvent;
  /** Statuses it leaves; `new` for a scan that does not exist yet. */
  from: readonly (ScanStatus | 'new')[];
  /** Statuses it may end in; `unchanged` moves only the counters; `removed` deletes the row. */
  to: readonly ScanStatus[] | 'unchanged' | 'removed';
  by: readonly ScanActor[];
  /** How the event reads in a refusal: "only … scans can be <verb>". */
  verb: string;
}

const LIVE = ['queued', 'running'] as const;

export const SCAN_TRANSITIONS: readonly ScanTransition[] = [
  { event: 'submit', from: ['new'], to: ['queued'], by: ['member'], verb: 'submitted' },
  { event: 'draft', from: ['new'], to: ['draft'], by: ['member'], verb: 'copied into a draft' },
  { event: 'start', from: ['queued'], to: ['running'], by: ['worker'], verb: 'started' },
  { event: 'store', from: LIVE, to: 'unchanged', by: ['worker'], verb: 'given points' },
  // completed when a point gave a spectrum, failed when every stored point is a failure record.
  { event: 'finish', from: LIVE, to: ['completed', 'failed'], by: ['worker', 'reconciler'], verb: 'finished' },
  { event: 'cancel', from: LIVE, to: ['cancelled'], by: ['owner or lead'], verb: 'cancelled' },
  // A retry of the failed points: they are deleted and computed again.
  { event: 'reopen', from: ['completed', 'failed', 'cancelled'], to: ['running'], by: ['owner or lead'], verb: 'reopened for a retry' },
  // Deleting marks the scan cancelled first (a worker holding a chunk then writes nothing), then removes it.
  { event: 'delete', from: SCAN_STATUSES, to: 'removed', by: ['lead', 'maintenance'], verb: 'deleted' },
];

/** A change the table does not allow. */
export class IllegalScanTransition extends Error {
  /** The API's error filter answers an error with a client status with that status: a conflict with the scan's state. */
  readonly status = 409;

  constructor(
    readonly event: ScanEvent,
    readonly from: ScanStatus | 'new',
    readonly by: ScanActor,
  ) {
    super(refusal(transitionOf(event), from, by));
    this.name = 'IllegalScanTransition';
  }
}

export function transitionOf(event: ScanEvent): ScanTransition {
  const transition = SCAN_TRANSITIONS.find((t) => t.event === event);
  if (!transition) throw new Error(`no scan transition '${event}'`);
  return transition;
}

/** Throws IllegalScanTransition unless `by` may take a scan in status `from` through `event`. */
export function checkTransition(event: ScanEvent, from: ScanStatus | 'new', by: ScanActor): void {
  const t = transitionOf(event);
  if (!t.from.includes(from) || !t.by.includes(by)) throw new IllegalScanTransition(event, from, by);
}

function refusal(t: ScanTransition, from: ScanStatus | 'new', by: ScanActor): string {
  if (!t.by.includes(by)) return `A scan can be ${t.verb} only by ${t.by.join(' or ')}, not by ${by}`;
  const allowed = t.from.filter((s) => s !== 'new');
  const list = allowed.length > 1 ? `${allowed.slice(0, -1).join(', ')} or ${allowed.at(-1)}` : allowed[0];
  return from === 'new' ? `A new scan cannot be ${t.verb}` : `The scan is ${from}; only ${list} scans can be ${t.verb}`;
}

/** Anything that runs SQL: a DataSource, or an EntityManager inside a transaction. */
export interface Queryable {
  query(sql: string, parameters?: unknown[]): Promise<unknown>;
}

const fromList = (event: ScanEvent) => transitionOf(event).from.filter((s) => s !== 'new');
const placeholders = (values: readonly unknown[]) => values.map(() => '?').join(', ');

/** The status and counter changes, each one row of the table. */
export const scanLifecycle = {
  /** A new scan, queued (`submit`) or as a draft (`draft`), saved inside the caller's transaction. */
  async create(tx: EntityManager, values: Omit<Partial<Scan>, 'status' | 'donePoints' | 'failedPoints'>, event: 'submit' | 'draft', by: ScanActor): Promise<Scan> {
    checkTransition(event, 'new', by);
    const [status] = transitionOf(event).to as readonly ScanStatus[];
    return tx.getRepository(Scan).save({ ...values, status, donePoints: 0, failedPoints: 0 });
  },

  /** A worker takes the first chunk of a queued scan; a scan already running stays as it is. */
  async start(db: Queryable, scanId: number): Promise<void> {
    await db.query(
      `UPDATE scans SET status = 'running', started_at = CURRENT_TIMESTAMP(3) WHERE id = ? AND status IN (${placeholders(fromList('start'))})`,
      [scanId, ...fromList('start')],
    );
  },

  /**
   * Locks a live scan's row for a store; false when it is gone or no longer live (cancelled,
   * deleted). Every store takes this lock first, so a cancel is either before the check or after
   * the store's commit.
   */
  async lockForStore(tx: Queryable, scanId: number): Promise<boolean> {
    const [row] = (await tx.query('SELECT status FROM scans WHERE id = ? FOR UPDATE', [scanId])) as { status: ScanStatus }[];
    return Boolean(row) && (fromList('store') as readonly string[]).includes(row.status);
  },

  /** Moves the counters by what a stored chunk changed, then finishes the scan if that was its last point. Under `lockForStore`. */
  async store(tx: Queryable, scanId: number, change: { ok: number; failed: number }): Promise<void> {
    await tx.query('UPDATE scans SET done_points = done_points + ?, failed_points = failed_points + ? WHERE id = ?', [change.ok, change.failed, scanId]);
    await scanLifecycle.finishIfAllStored(tx, scanId);
  },

  /**
   * The one rule for finishing: a live scan finishes exactly when its last point is stored, as
   * `completed`, or as `failed` when not one point gave a spectrum (every point is a failure record).
   */
  async finishIfAllStored(db: Queryable, scanId: number): Promise<void> {
    await db.query(
      `UPDATE scans SET status = IF(done_points = 0 AND failed_points > 0, 'failed', 'completed'), finished_at = CURRENT_TIMESTAMP(3)
        WHERE id = ? AND status IN (${placeholders(fromList('finish'))}) AND done_points + failed_points >= total_points`,
      [scanId, ...fromList('finish')],
    );
  },

  /** Cancels a live scan; refused (IllegalScanTransition) from any other status, also when it finished meanwhile. */
  async cancel(db: Queryable, scanId: number, current: ScanStatus, by: ScanActor): Promise<void> {
    checkTransition('cancel', current, by);
    const result = (await db.query(
      `UPDATE scans SET status = 'cancelled', finished_at = CURRENT_TIMESTAMP(3) WHERE id = ? AND status IN (${placeholders(fromList('cancel'))})`,
      [scanId, ...fromList('cancel')],
    )) as { affectedRows?: number };
    if (result.affectedRows === 0) {
      const [row] = (await db.query('SELECT status FROM scans WHERE id = ?', [scanId])) as { status: ScanStatus }[];
      throw new IllegalScanTransition('cancel', row?.status ?? current, by);
    }
  },

  /**
   * Reopens a finished scan whose failed points were just deleted (`removed` of them), inside the
   * caller's transaction that holds the scan's row lock: it runs again until they are stored anew.
   */
  async reopen(tx: Queryable, scanId: number, current: ScanStatus, by: ScanActor, removed: number): Promise<void> {
    checkTransition('reopen', current, by);
    await tx.query(
      `UPDATE scans SET status = 'running', finished_at = NULL, finish_notified_at = NULL, failed_points = failed_points - ? WHERE id = ? AND status IN (${placeholders(fromList('reopen'))})`,
      [removed, scanId, ...fromList('reopen')],
    );
  },

  /** Deletes a scan inside the caller's transaction (its points cascade): cancelled first, so a worker holding a chunk writes nothing. */
  async remove(tx: EntityManager, scanId: number, current: ScanStatus, by: ScanActor): Promise<void> {
    checkTransition('delete', current, by);
    await tx.query("UPDATE scans SET status = 'cancelled' WHERE id = ?", [scanId]);
    await tx.getRepository(Scan).delete({ id: scanId });
  },
};
