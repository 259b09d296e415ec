import { Injectable, Logger } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import type { NotificationKind, NotificationPayload } from '@sixtyfold/shared';
import { NotificationsService } from './notifications.service';

interface FinishedScan {
  id: number;
  name: string;
  status: 'completed' | 'failed' | 'cancelled';
  owner_id: number;
  group_id: number;
  done_points: number;
  failed_points: number;
  finished_at: Date | null;
}

/**
 * Tells owners that their scan finished. The worker and the API only set the status; this finds
 * finished scans not yet announced and claims each with a conditional UPDATE in the same
 * transaction as the notification, so exactly one process announces each finish.
 */
@Injectable()
export class ScanFinishNotifierService {
  private readonly logger = new Logger('ScanFinishNotifier');

  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly notifications: NotificationsService,
  ) {}

  /** Returns how many finishes this call announced. */
  async announceFinished(): Promise<number> {
    const finished: FinishedScan[] = await this.db.query(
      `SELECT id, name, status, owner_id, group_id, done_points, failed_points, finished_at FROM scans
        WHERE status IN ('completed', 'failed', 'cancelled') AND finish_notified_at IS NULL ORDER BY id LIMIT 200`,
    );
    let announced = 0;
    for (const scan of finished) {
      try {
        const won = await this.db.transaction(async (tx) => {
          const claim: { affectedRows: number } = await tx.query(
            'UPDATE scans SET finish_notified_at = CURRENT_TIMESTAMP(3) WHERE id = ? AND finish_notified_at IS NULL', [scan.id],
          );
          if (claim.affectedRows !== 1) return false;
          const kind = finishKind(scan);
          const payload: NotificationPayload = {
            title: TITLES[kind](scan.name), link: `/scans/${scan.id}`, scanId: scan.id, scanName: scan.name, groupId: scan.group_id,
            donePoints: scan.done_points, failedPoints: scan.failed_points,
            actorName: kind === 'scan_cancelled' ? await this.cancelledBy(tx, scan) : undefined,
          };
          // A retried scan finishes again later: its finish time keeps the event keys apart.
          const finishedAt = scan.finished_at ? new Date(scan.finished_at).getTime() : 0;
          await this.notifications.notify(scan.owner_id, kind, payload, `scan-${scan.id}-${scan.status}-${finishedAt}`, tx);
          return true;
        });
        if (won) announced += 1;
      } catch (err) {
        this.logger.warn(`announcing scan ${scan.id} failed, will retry: ${(err as Error).message}`);
      }
    }
    if (announced) void this.notifications.sendImmediate();
    return announced;
  }

  /** Who cancelled, from the audit trail (the owner themselves included). */
  private async cancelledBy(tx: { query: DataSource['query'] }, scan: FinishedScan): Promise<string | undefined> {
    const rows: { display_name: string }[] = await tx.query(
      `SELECT u.display_name FROM audit_events a JOIN users u ON u.id = a.actor_id
        WHERE a.action = 'scan.cancel' AND a.target_type = 'scan' AND a.target_id = ? ORDER BY a.id DESC LIMIT 1`,
      [String(scan.id)],
    );
    return rows[0]?.display_name;
  }
}

/** The notice follows the status the scan finished with (see `scanLifecycle.finishIfAllStored`). */
function finishKind(scan: FinishedScan): NotificationKind {
  if (scan.status === 'cancelled') return 'scan_cancelled';
  if (scan.status === 'failed') return 'scan_failed';
  return 'scan_completed';
}

const TITLES: Record<NotificationKind, (name: string) => string> = {
  scan_completed: (name) => `Scan "${name}" completed`,
  scan_failed: (name) => `Scan "${name}" failed`,
  scan_cancelled: (name) => `Scan "${name}" was cancelled`,
  mentioned: (name) => `Mentioned on "${name}"`,
  invited: () => 'Invitation',
};
