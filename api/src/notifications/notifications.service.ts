import { Injectable, Logger, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource, EntityManager } from 'typeorm';
import type {
  DigestRun, NotificationDto, NotificationEmailMode, NotificationKind, NotificationListQuery, NotificationPayload, Page, UserPreferences,
} from '@sixtyfold/shared';
import type { SessionUser } from '../common/session-user';
import { MailService } from '../mail/mail.service';
import { User } from '../users/entities/user.entity';
import { Notification } from './entities/notification.entity';
import { digestMail, singleNotificationMail } from './notification-mail';

interface WriteResult {
  affectedRows: number;
}

/**
 * Records what happened for whom (once per event and user, by the unique event key) and sends
 * the e-mails each user asked for. Sending claims a row first with a conditional UPDATE, so a
 * second API process or a retry never sends the same message twice; a failed send releases the
 * claim and the next tick tries again.
 */
@Injectable()
export class NotificationsService {
  private readonly logger = new Logger('Notifications');
  private flushing = false;

  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly mail: MailService,
  ) {}

  /**
   * Records `kind` for each user; an event key already recorded for a user is skipped. Pass the
   * transaction's manager to commit with the change, then call `sendImmediate()` after the commit.
   */
  async notify(userIds: number | number[], kind: NotificationKind, payload: NotificationPayload, eventKey: string, manager?: EntityManager): Promise<number> {
    const ids = [...new Set(Array.isArray(userIds) ? userIds : [userIds])];
    if (!ids.length) return 0;
    const db = manager ?? this.db.manager;
    const result = await db
      .createQueryBuilder()
      .insert()
      .into(Notification)
      .values(ids.map((userId) => ({ userId, kind, payload, eventKey })))
      .orIgnore()
      .updateEntity(false)
      .execute();
    const recorded = (result.raw as WriteResult).affectedRows ?? 0;
    if (!manager) void this.sendImmediate();
    return recorded;
  }

  /** Sends every pending notification of users who chose 'immediate'; those of 'never' are settled unsent. */
  async sendImmediate(): Promise<number> {
    if (this.flushing) return 0;
    this.flushing = true;
    let sent = 0;
    try {
      await this.db.query(
        `UPDATE notifications n JOIN users u ON u.id = n.user_id SET n.emailed_at = CURRENT_TIMESTAMP(3)
          WHERE n.emailed_at IS NULL AND u.notification_email = 'never'`,
      );
      const pending: { id: number; email: string; kind: NotificationKind; payload: string | NotificationPayload }[] = await this.db.query(
        `SELECT n.id, u.email, n.kind, n.payload FROM notifications n JOIN users u ON u.id = n.user_id
          WHERE n.emailed_at IS NULL AND u.notification_email = 'immediate' ORDER BY n.id LIMIT 200`,
      );
      for (const row of pending) {
        const claim: WriteResult = await this.db.query('UPDATE notifications SET emailed_at = CURRENT_TIMESTAMP(3) WHERE id = ? AND emailed_at IS NULL', [row.id]);
        if (claim.affectedRows !== 1) continue;
        try {
          await this.mail.send(row.email, singleNotificationMail(row.kind, parsePayload(row.payload), (p) => this.mail.link(p)));
          sent += 1;
        } catch (err) {
          await this.db.query('UPDATE notifications SET emailed_at = NULL WHERE id = ?', [row.id]);
          this.logger.warn(`e-mail for notification ${row.id} failed, will retry: ${(err as Error).message}`);
        }
      }
    } catch (err) {
      this.logger.warn(`sending notifications failed, will retry: ${(err as Error).message}`);
    } finally {
      this.flushing = false;
    }
    return sent;
  }

  /** One digest per 'daily' user with anything pending: everything unsent since the last one. */
  async sendDigests(): Promise<DigestRun> {
    const users: { id: number; email: string }[] = await this.db.query(
      `SELECT DISTINCT u.id, u.email FROM notifications n JOIN users u ON u.id = n.user_id
        WHERE n.emailed_at IS NULL AND u.notification_email = 'daily'`,
    );
    const run: DigestRun = { users: 0, notifications: 0 };
    for (const user of users) {
      // The claim stamp tells this run's rows from any other process's.
      const stamp = new Date();
      const claim: WriteResult = await this.db.query(
        `UPDATE notifications SET emailed_at = ? WHERE user_id = ? AND emailed_at IS NULL`, [stamp, user.id],
      );
      if (claim.affectedRows === 0) continue;
      const rows: { id: number; kind: NotificationKind; payload: string | NotificationPayload }[] = await this.db.query(
        'SELECT id, kind, payload FROM notifications WHERE user_id = ? AND emailed_at = ? ORDER BY id', [user.id, stamp],
      );
      try {
        await this.mail.send(user.email, digestMail(rows.map((r) => ({ kind: r.kind, payload: parsePayload(r.payload) })), (p) => this.mail.link(p)));
        run.users += 1;
        run.notifications += rows.length;
      } catch (err) {
        await this.db.query('UPDATE notifications SET emailed_at = NULL WHERE user_id = ? AND emailed_at = ?', [user.id, stamp]);
        this.logger.warn(`digest for user ${user.id} failed, will retry: ${(err as Error).message}`);
      }
    }
    if (run.users) this.logger.log(`sent ${run.users} digest(s) with ${run.notifications} notification(s)`);
    return run;
  }

  async list(user: SessionUser, query: NotificationListQuery): Promise<Page<NotificationDto>> {
    const repo = this.db.getRepository(Notification);
    const qb = repo.createQueryBuilder('n').where('n.userId = :userId', { userId: user.id });
    if (query.unread) qb.andWhere('n.readAt IS NULL');
    const [rows, total] = await qb
      .orderBy('n.createdAt', 'DESC')
      .addOrderBy('n.id', 'DESC')
      .skip((query.page - 1) * query.pageSize)
      .take(query.pageSize)
      .getManyAndCount();
    return { items: rows.map(toDto), total, page: query.page, pageSize: query.pageSize };
  }

  async unreadCount(user: SessionUser): Promise<number> {
    return this.db.getRepository(Notification).createQueryBuilder('n').where('n.userId = :id AND n.readAt IS NULL', { id: user.id }).getCount();
  }

  /** Someone else's notification answers 404, like any object the caller cannot see. */
  async markRead(user: SessionUser, id: number): Promise<NotificationDto> {
    const repo = this.db.getRepository(Notification);
    const row = await repo.findOneBy({ id, userId: user.id });
    if (!row) throw new NotFoundException('No such notification');
    if (!row.readAt) {
      row.readAt = new Date();
      await repo.update({ id }, { readAt: row.readAt });
    }
    return toDto(row);
  }

  async markAllRead(user: SessionUser): Promise<number> {
    const result: WriteResult = await this.db.query('UPDATE notifications SET read_at = CURRENT_TIMESTAMP(3) WHERE user_id = ? AND read_at IS NULL', [user.id]);
    return result.affectedRows;
  }

  async preferences(user: SessionUser): Promise<UserPreferences> {
    const row = await this.db.getRepository(User).findOneByOrFail({ id: user.id });
    return { notificationEmail: row.notificationEmail };
  }

  async setPreferences(user: SessionUser, prefs: UserPreferences): Promise<UserPreferences> {
    await this.db.getRepository(User).update({ id: user.id }, { notificationEmail: prefs.notificationEmail as NotificationEmailMode });
    return this.preferences(user);
  }
}

// The mysql driver answers JSON columns of raw queries as text.
function parsePayload(value: string | NotificationPayload): NotificationPayload {
  return typeof value === 'string' ? (JSON.parse(value) as NotificationPayload) : value;
}

function toDto(n: Notification): NotificationDto {
  return { id: n.id, kind: n.kind, payload: n.payload, createdAt: n.createdAt.toISOString(), readAt: n.readAt?.toISOString() ?? null };
}
