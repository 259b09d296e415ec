import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { GroupsModule } from '../groups/groups.module';
import { MailModule } from '../mail/mail.module';
import { NotificationsModule } from '../notifications/notifications.module';
import { User } from '../users/entities/user.entity';
import { UsersModule } from '../users/users.module';
import { Invitation } from './entities/invitation.entity';
import { GroupInvitationsController, InvitationLinksController } from './invitations.controller';
import { InvitationsService } from './invitations.service';

@Module({
  imports: [TypeOrmModule.forFeature([Invitation, User]), GroupsModule, MailModule, AuditModule, UsersModule, NotificationsModule],
  controllers: [GroupInvitationsController, InvitationLinksController],
  providers: [InvitationsService],
  exports: [InvitationsService],
})
export class InvitationsModule {}
