import { Module } from '@nestjs/common';
import { MailModule } from '../mail/mail.module';
import { SchedulingModule } from '../scheduling/scheduling.module';
import { NotificationSchedulerService } from './notification-scheduler.service';
import { NotificationsAdminController } from './notifications-admin.controller';
import { NotificationsController, PreferencesController } from './notifications.controller';
import { NotificationsService } from './notifications.service';
import { ScanFinishNotifierService } from './scan-finish-notifier.service';

@Module({
  imports: [MailModule, SchedulingModule],
  controllers: [NotificationsController, PreferencesController, NotificationsAdminController],
  providers: [NotificationsService, ScanFinishNotifierService, NotificationSchedulerService],
  exports: [NotificationsService],
})
export class NotificationsModule {}
