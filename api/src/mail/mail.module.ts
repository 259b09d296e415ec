import { Module } from '@nestjs/common';
import { MailOutboxController } from './mail-outbox.controller';
import { MailOutboxService } from './mail-outbox.service';
import { MailQuotaService } from './mail-quota.service';
import { MailService } from './mail.service';

@Module({
  controllers: [MailOutboxController],
  providers: [MailService, MailOutboxService, MailQuotaService],
  exports: [MailService, MailQuotaService],
})
export class MailModule {}
