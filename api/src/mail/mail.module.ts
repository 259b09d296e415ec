import { Module } from '@nestjs/common';
import { MailOutboxController } from './mail-outbox.controller';
import { MailOutboxService } from './mail-outbox.service';
import { MailService } from './mail.service';

@Module({
  controllers: [MailOutboxController],
  providers: [MailService, MailOutboxService],
  exports: [MailService],
})
export class MailModule {}
