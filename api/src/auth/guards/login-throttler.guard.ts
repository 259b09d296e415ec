import { HttpException, HttpStatus, Injectable, type ExecutionContext } from '@nestjs/common';
import { ThrottlerGuard, type ThrottlerLimitDetail, type ThrottlerOptions } from '@nestjs/throttler';
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

@Injectable()
export class LoginThrottlerGuard extends ThrottlerGuard {
  protected override async getTracker(req: Record<string, unknown>): Promise<string> {
    return `address:${await super.getTracker(req)}`;
  }

  protected override async throwThrottlingException(_context: ExecutionContext, detail: ThrottlerLimitDetail): Promise<void> {
    // Whole seconds: @nest-lab/throttler-storage-redis rounds the block key's PTTL up (1 s at least while blocked).
    const retryAfter = detail.timeToBlockExpire;
    const window = `${Math.round(detail.ttl / 1000)} s`;
    const which = detail.tracker.startsWith('account:')
      ? `for this account (at most ${detail.limit} in ${window}, from anywhere)`
      : `from your address (at most ${detail.limit} in ${window}, whatever the e-mail)`;
    throw new HttpException({ message: `Too many sign-in attempts ${which}; try again in ${retryAfter} s`, retryAfter }, HttpStatus.TOO_MANY_REQUESTS);
  }
}
