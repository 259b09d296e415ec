import { Injectable, Logger, type OnApplicationBootstrap, type OnApplicationShutdown } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { SchedulerRegistry } from '@nestjs/schedule';
import type { NotificationsConfig } from '../config/notifications.config';
import { ScheduledRunsService } from '../scheduling/scheduled-runs.service';
import { NotificationsService } from './notifications.service';
import { ScanFinishNotifierService } from './scan-finish-notifier.service';

const DIGEST_JOB = 'notification-digest';

/** The timed parts: a short tick (finished scans, immediate e-mails) and the daily digest, each run in one API process. */
@Injectable()
export class NotificationSchedulerService implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger('NotificationScheduler');
  private timer: NodeJS.Timeout | undefined;
  private ticking = false;

  constructor(
    private readonly config: ConfigService,
    private readonly registry: SchedulerRegistry,
    private readonly notifications: NotificationsService,
    private readonly finishes: ScanFinishNotifierService,
    private readonly runs: ScheduledRunsService,
  ) {}

  onApplicationBootstrap(): void {
    const { intervalSeconds, digestCron } = this.config.getOrThrow<NotificationsConfig>('notifications');
    if (intervalSeconds > 0) this.timer = this.runs.every('notification-tick', intervalSeconds * 1000, () => this.tick());
    const job = this.runs.cron(DIGEST_JOB, digestCron, undefined, () =>
      this.notifications.sendDigests().catch((err: Error) => this.logger.warn(`digest run failed: ${err.message}`)),
    );
    this.registry.addCronJob(DIGEST_JOB, job);
  }

  onApplicationShutdown(): void {
    clearInterval(this.timer);
    if (this.registry.doesExist('cron', DIGEST_JOB)) this.registry.deleteCronJob(DIGEST_JOB);
  }

  async tick(): Promise<void> {
    if (this.ticking) return;
    this.ticking = true;
    try {
      await this.finishes.announceFinished();
      await this.notifications.sendImmediate();
    } catch (err) {
      this.logger.warn(`notification tick failed: ${(err as Error).message}`);
    } finally {
      this.ticking = false;
    }
  }
}
