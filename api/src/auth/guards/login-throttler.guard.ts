import { HttpException, HttpStatus, Injectable, type ExecutionContext } from '@nestjs/common';
import { ThrottlerGuard, type ThrottlerLimitDetail, type ThrottlerOptions, type ThrottlerStorage } from '@nestjs/throttler';
import type { Request } from 'express';
import type { AppConfig } from '../../config/app.config';

/** The e-mail as the sign-in form sends it, in the form accounts are looked up by. */
function signInEmail(req: Record<string, unknown>): string {
  const email = (req as unknown as Request).body?.email;
  return typeof email === 'string' ? email.trim().toLowerCase() : '';
}

/**
 * Two limits on sign-in attempts, counted in Redis so that every API process shares them:
 * per address (whatever the e-mails: one machine trying many accounts) and per account
 * (whatever the addresses: many machines guessing one password). Each tracker starts with its
 * limit's name, so that the refusal can say which limit was reached.
 */
export function loginThrottlers(config: AppConfig['loginThrottle']): ThrottlerOptions[] {
  return [
    // No getTracker: the guard's own, the client address (an IPv6 /64 counts as one address).
    { name: 'address', limit: config.addressLimit, ttl: config.ttlMs },
    { name: 'account', limit: config.accountLimit, ttl: config.ttlMs, getTracker: (req) => `account:${signInEmail(req)}` },
  ];
}

/**
 * @nestjs-redis/throttler-storage 1.0.0 reports `timeToBlockExpire` as (block time left in ms)
 * minus (Unix time in s) instead of seconds; this turns that back into seconds, and leaves a
 * value that is already plausible as it is. The counting itself is unaffected.
 */
export class RetryAfterSeconds implements ThrottlerStorage {
  constructor(private readonly storage: ThrottlerStorage) {}

  async increment(key: string, ttl: number, limit: number, blockDuration: number, throttlerName: string) {
    const record = await this.storage.increment(key, ttl, limit, blockDuration, throttlerName);
    if (!record.isBlocked) return record;
    const reported = record.timeToBlockExpire;
    const longest = Math.ceil(blockDuration / 1000);
    // Adding the Unix time back gives the milliseconds left to within one.
    const seconds = reported > 0 && reported <= longest ? reported : Math.ceil((reported + Date.now() / 1000 - 1) / 1000);
    return { ...record, timeToBlockExpire: Math.min(longest, Math.max(1, seconds)) };
  }
}

@Injectable()
export class LoginThrottlerGuard extends ThrottlerGuard {
  protected override async getTracker(req: Record<string, unknown>): Promise<string> {
    return `address:${await super.getTracker(req)}`;
  }

  protected override async throwThrottlingException(_context: ExecutionContext, detail: ThrottlerLimitDetail): Promise<void> {
    const retryAfter = detail.timeToBlockExpire;
    const window = `${Math.round(detail.ttl / 1000)} s`;
    const which = detail.tracker.startsWith('account:')
      ? `for this account (at most ${detail.limit} in ${window}, from anywhere)`
      : `from your address (at most ${detail.limit} in ${window}, whatever the e-mail)`;
    throw new HttpException({ message: `Too many sign-in attempts ${which}; try again in ${retryAfter} s`, retryAfter }, HttpStatus.TOO_MANY_REQUESTS);
  }
}
