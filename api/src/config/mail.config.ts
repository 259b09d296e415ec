import { registerAs } from '@nestjs/config';
import { z } from 'zod';
import { parseEnv } from './parse-env';

const booleanish = z.enum(['true', 'false', '1', '0']).transform((v) => v === 'true' || v === '1');

const schema = z.object({
  SMTP_HOST: z.string().min(1).default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2560),
  /** true: TLS from the first byte (port 465); false: plain, upgraded by STARTTLS when offered. */
  SMTP_SECURE: booleanish.default(false),
  /** The local mail catcher offers no TLS; a real relay should leave this false. */
  SMTP_IGNORE_TLS: booleanish.default(false),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().min(3).default('Sixtyfold <no-reply@sixtyfold.example>'),
  /** The web app's address as users reach it, for links in e-mails. */
  APP_URL: z.url({ error: 'APP_URL must be an absolute URL, e.g. https://sixtyfold.halvorsen.example/' }).default('http://127.0.0.1:3060/'),
  /** Folder the local mail catcher writes to; set only in development and tests (the admins' outbox page). */
  MAIL_OUTBOX_DIR: z.string().min(1).optional(),
  /** E-mails one user may cause within an hour: people told of an @-mention, and invitations sent. */
  MAIL_MENTION_LIMIT_PER_HOUR: z.coerce.number().int().min(1).default(30),
  MAIL_INVITATION_LIMIT_PER_HOUR: z.coerce.number().int().min(1).default(20),
});

export interface MailConfig {
  transport: {
    host: string;
    port: number;
    secure: boolean;
    ignoreTLS: boolean;
    auth?: { user: string; pass: string };
  };
  from: string;
  appUrl: string;
  outboxDir: string | null;
  limitsPerHour: { mention: number; invitation: number };
}

export function readMailConfig(env: NodeJS.ProcessEnv = process.env): MailConfig {
  const e = parseEnv(schema, env, 'mail');
  return {
    transport: {
      host: e.SMTP_HOST,
      port: e.SMTP_PORT,
      secure: e.SMTP_SECURE,
      ignoreTLS: e.SMTP_IGNORE_TLS,
      ...(e.SMTP_USER ? { auth: { user: e.SMTP_USER, pass: e.SMTP_PASSWORD ?? '' } } : {}),
    },
    from: e.MAIL_FROM,
    appUrl: e.APP_URL.endsWith('/') ? e.APP_URL : `${e.APP_URL}/`,
    outboxDir: e.MAIL_OUTBOX_DIR ?? null,
    limitsPerHour: { mention: e.MAIL_MENTION_LIMIT_PER_HOUR, invitation: e.MAIL_INVITATION_LIMIT_PER_HOUR },
  };
}

export const mailConfig = registerAs('mail', () => readMailConfig());
