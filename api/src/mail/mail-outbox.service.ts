import { Injectable, NotFoundException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import type { OutboxMessage, OutboxMessageSummary, OutboxQuery, Page } from '@sixtyfold/shared';
import type { MailConfig } from '../config/mail.config';

/** Message ids are the catcher's file names: a time stamp and a counter. */
const MESSAGE_ID = /^\d{13}-\d{6}$/;

/**
 * Reads what the local mail catcher received (deploy/scripts/mail-catcher.mjs writes one JSON
 * file per message). Only configured in development and tests, where no real mail is sent.
 */
@Injectable()
export class MailOutboxService {
  private readonly dir: string | null;

  constructor(config: ConfigService) {
    this.dir = config.getOrThrow<MailConfig>('mail').outboxDir;
  }

  async list(query: OutboxQuery): Promise<Page<OutboxMessageSummary>> {
    const dir = this.requireDir();
    const ids = (await readdir(dir).catch(() => [] as string[]))
      .filter((f) => f.endsWith('.json'))
      .map((f) => f.slice(0, -5))
      .filter((id) => MESSAGE_ID.test(id))
      .sort()
      .reverse(); // newest first
    const all = await Promise.all(ids.map((id) => this.read(id)));
    const wanted = query.to ? all.filter((m) => m.to.some((t) => t.toLowerCase() === query.to)) : all;
    const start = (query.page - 1) * query.pageSize;
    return {
      items: wanted.slice(start, start + query.pageSize).map(({ id, receivedAt, from, to, subject }) => ({ id, receivedAt, from, to, subject })),
      total: wanted.length,
      page: query.page,
      pageSize: query.pageSize,
    };
  }

  async get(id: string): Promise<OutboxMessage> {
    this.requireDir();
    if (!MESSAGE_ID.test(id)) throw new NotFoundException('No such message');
    return this.read(id);
  }

  private requireDir(): string {
    if (!this.dir) throw new NotFoundException('This site sends mail through a real SMTP relay; there is no local outbox');
    return this.dir;
  }

  private async read(id: string): Promise<OutboxMessage> {
    let raw: string;
    try {
      raw = await readFile(path.join(this.requireDir(), `${id}.json`), 'utf8');
    } catch {
      throw new NotFoundException('No such message');
    }
    const m = JSON.parse(raw) as OutboxMessage;
    return { id: m.id, receivedAt: m.receivedAt, from: m.from, to: m.to, subject: m.subject, text: m.text, html: m.html, messageId: m.messageId };
  }
}
