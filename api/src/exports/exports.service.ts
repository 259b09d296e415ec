import { type BeforeApplicationShutdown, HttpException, HttpStatus, Injectable, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { Response } from 'express';
import type { Duplex } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { SessionUser } from '../common/session-user';
import type { ExportsConfig } from '../config/exports.config';
import type { ExportSource } from './query-stream';

export interface Download {
  headers: Record<string, string>;
  /** Opened only once the export may run; a failure here (404, 503) is still a normal answer. */
  open: () => Promise<ExportSource>;
  /** Transforms between the source and the response (rows to CSV, to JSON). */
  stages?: Duplex[];
}

/** Errors that only say the client went away. */
const CLIENT_GONE = new Set(['ERR_STREAM_PREMATURE_CLOSE', 'ECONNRESET', 'EPIPE', 'ERR_STREAM_DESTROYED']);

/**
 * Every streamed download (points as CSV or JSON, archives) goes through here: at most
 * `EXPORTS_PER_USER` per person and `EXPORTS_PER_SITE` in all at once in this API process (429
 * beyond), source → stages → response as ONE pipeline, so a client that hangs up, or takes no bytes
 * for `EXPORT_STALL_SECONDS`, ends the query and lets go of its connection at once; and on shutdown
 * the open downloads are ended, so the API stops without waiting for them.
 */
@Injectable()
export class ExportsService implements BeforeApplicationShutdown {
  private readonly logger = new Logger('Exports');
  private readonly limits: ExportsConfig;
  private readonly running = new Set<Response>();
  private readonly perUser = new Map<number, number>();

  constructor(config: ConfigService) {
    this.limits = config.getOrThrow<ExportsConfig>('exports');
  }

  async send(user: SessionUser, res: Response, download: Download): Promise<void> {
    this.take(user, res);
    const stopWatching = this.endWhenStalled(res);
    let source: ExportSource | undefined;
    let completed = false;
    try {
      source = await download.open();
      for (const [name, value] of Object.entries(download.headers)) res.setHeader(name, value);
      await pipeline([source.readable, ...(download.stages ?? []), res]);
      completed = true;
    } catch (err) {
      // Before the source opened nothing was sent, and the error is the answer (404, 503).
      if (!source) throw err;
      // After, the response is already gone with the pipeline: the client sees a cut download.
      const code = (err as NodeJS.ErrnoException).code;
      if (!code || !CLIENT_GONE.has(code)) this.logger.warn(`a download ended early: ${(err as Error).message}`);
    } finally {
      stopWatching();
      this.give(user, res);
      await source?.close(completed);
    }
  }

  /** The open downloads, per person and in all. */
  counts(): { running: number; perUser: number; perSite: number } {
    return { running: this.running.size, perUser: this.limits.perUser, perSite: this.limits.perSite };
  }

  beforeApplicationShutdown(): void {
    for (const res of this.running) res.destroy(new Error('the API is stopping'));
  }

  private take(user: SessionUser, res: Response): void {
    const mine = this.perUser.get(user.id) ?? 0;
    if (mine >= this.limits.perUser) {
      throw new HttpException(`You already have ${mine} downloads running, the most one person may have at once; wait for one to finish`, HttpStatus.TOO_MANY_REQUESTS);
    }
    if (this.running.size >= this.limits.perSite) {
      throw new HttpException(`${this.running.size} downloads are running, the most this server runs at once; try again in a moment`, HttpStatus.TOO_MANY_REQUESTS);
    }
    this.perUser.set(user.id, mine + 1);
    this.running.add(res);
  }

  private give(user: SessionUser, res: Response): void {
    const mine = (this.perUser.get(user.id) ?? 1) - 1;
    if (mine > 0) this.perUser.set(user.id, mine);
    else this.perUser.delete(user.id);
    this.running.delete(res);
  }

  /** Ends the response when the client has taken no bytes for the stall time (its socket buffers stay full). */
  private endWhenStalled(res: Response): () => void {
    const { stallMs } = this.limits;
    let progressAt = Date.now();
    const onDrain = () => (progressAt = Date.now());
    res.on('drain', onDrain);
    const timer = setInterval(() => {
      if (!res.writableNeedDrain) progressAt = Date.now();
      else if (Date.now() - progressAt >= stallMs) res.destroy(new Error(`the client took no data for ${stallMs / 1000} s`));
    }, Math.min(1000, stallMs / 4));
    return () => {
      clearInterval(timer);
      res.off('drain', onDrain);
    };
  }
}
