import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { GroupsModule } from '../groups/groups.module';
import { MailModule } from '../mail/mail.module';
import { NotificationsModule } from '../notifications/notifications.module';
import { CommentsController } from './comments.controller';
import { CommentsService } from './comments.service';

@Module({
  imports: [GroupsModule, AuditModule, NotificationsModule, MailModule],
  controllers: [CommentsController],
  providers: [CommentsService],
})
export class CommentsModule {}
