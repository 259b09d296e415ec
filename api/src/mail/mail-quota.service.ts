import { HttpException, HttpStatus, Inject, Injectable } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { MailConfig } from '../config/mail.config';
import { REDIS_CLIENT, type RedisClient } from '../redis/redis.module';

export type MailQuotaKind = keyof MailConfig['limitsPerHour'];

const HOUR_MS = 3600_000;

// Takes `count` from the user's hour or nothing, in one step, so that API processes sharing
// Redis never let two requests through on the same remaining e-mails. The hour starts with the
// first e-mail (a fixed window). Answers {taken (1|0), used, ms until the hour ends}.
const TAKE_SCRIPT = `
local used = tonumber(redis.call('GET', KEYS[1]) or '0')
local count = tonumber(ARGV[1])
if used + count > tonumber(ARGV[2]) then
  return {0, used, redis.call('PTTL', KEYS[1])}
end
used = redis.call('INCRBY', KEYS[1], count)
if redis.call('PTTL', KEYS[1]) < 0 then redis.call('PEXPIRE', KEYS[1], ARGV[3]) end
return {1, used, redis.call('PTTL', KEYS[1])}
`;

/** "40 s", "12 min": waits as people read them. */
function formatWait(seconds: number): string {
  return seconds < 60 ? `${seconds} s` : `${Math.ceil(seconds / 60)} min`;
}

/**
 * How many e-mails one user may cause in an hour (MAIL_*_LIMIT_PER_HOUR), counted in Redis and
 * shared by every API process. Past the limit the request is refused with a 429 that says the
 * limit and when to try again (Retry-After), before anything is saved or sent.
 */
@Injectable()
export class MailQuotaService {
  private readonly limits: MailConfig['limitsPerHour'];

  constructor(
    config: ConfigService,
    @Inject(REDIS_CLIENT) private readonly redis: RedisClient,
  ) {
    this.limits = config.getOrThrow<MailConfig>('mail').limitsPerHour;
  }

  /**
   * Counts `count` e-mails of `kind` caused by the user, or throws the 429 and counts nothing.
   * A request that fails after this (a database error, a refused mail) keeps what it took: the
   * error is on the side of fewer e-mails.
   */
  async take(userId: number, kind: MailQuotaKind, count: number): Promise<void> {
    if (count <= 0) return;
    const limit = this.limits[kind];
    const key = `sixtyfold:mail-quota:${kind}:${userId}`;
    const [taken, used, ttlMs] = (await this.redis.eval(TAKE_SCRIPT, 1, key, count, limit, HOUR_MS)) as [number, number, number];
    if (taken === 1) return;
    const retryAfter = ttlMs > 0 ? Math.ceil(ttlMs / 1000) : HOUR_MS / 1000;
    const wait = formatWait(retryAfter);
    const people = `${count} mentioned ${count === 1 ? 'person' : 'people'}`;
    const message =
      kind === 'invitation' ? `You may send at most ${limit} invitations an hour (${used} so far), so this invitation was not saved or sent. Try again in ${wait}.`
      : count > limit ? `This would e-mail ${people}, more than the ${limit} an hour your @-mentions may e-mail, so the comment was not saved. Mention fewer people.`
      : `This would e-mail ${people}, but your @-mentions may e-mail at most ${limit} people an hour (${used} so far), so the comment was not saved. ` +
        `Try again in ${wait}, or send it without the @-mentions.`;
    throw new HttpException({ message, retryAfter }, HttpStatus.TOO_MANY_REQUESTS);
  }
}
