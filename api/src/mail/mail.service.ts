import { Injectable, Logger, type OnModuleDestroy } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import nodemailer, { type Transporter } from 'nodemailer';
import type { MailConfig } from '../config/mail.config';
import { renderMail, type MailContent } from './mail-layout';

export interface SentMail {
  messageId: string;
  accepted: string[];
}

/**
 * Sends e-mail over SMTP: the local mail catcher in development and tests, a real relay in
 * production. Which one is configuration only (SMTP_* variables).
 */
@Injectable()
export class MailService implements OnModuleDestroy {
  private readonly logger = new Logger(MailService.name);
  private readonly config: MailConfig;
  private readonly transporter: Transporter;

  constructor(config: ConfigService) {
    this.config = config.getOrThrow<MailConfig>('mail');
    this.transporter = nodemailer.createTransport({ ...this.config.transport, pool: true, maxConnections: 2 });
  }

  /** An absolute link into the web app, e.g. `link('invitations/abc')`. */
  link(pathInApp: string): string {
    return new URL(pathInApp.replace(/^\//, ''), this.config.appUrl).toString();
  }

  /** Sends one message; throws when the server refuses it, so callers can keep it for a retry. */
  async send(to: string, content: MailContent): Promise<SentMail> {
    const mail = renderMail(content);
    const info = await this.transporter.sendMail({ from: this.config.from, to, subject: mail.subject, text: mail.text, html: mail.html });
    this.logger.log(`sent "${mail.subject}" to ${to}`);
    return { messageId: info.messageId, accepted: (info.accepted ?? []).map(String) };
  }

  onModuleDestroy(): void {
    this.transporter.close();
  }
}
