import { Injectable } from '@nestjs/common';
import { ThrottlerException, ThrottlerGuard } from '@nestjs/throttler';
import type { Request } from 'express';

/**
 * Throttles sign-in attempts per address and e-mail, so guessing one account's password is
 * slowed without locking out a whole institute behind one NAT.
 */
@Injectable()
export class LoginThrottlerGuard extends ThrottlerGuard {
  protected override async getTracker(req: Record<string, unknown>): Promise<string> {
    const request = req as unknown as Request;
    const email = typeof request.body?.email === 'string' ? request.body.email.trim().toLowerCase() : '';
    return `${request.ip}|${email}`;
  }

  protected override async throwThrottlingException(): Promise<void> {
    throw new ThrottlerException('Too many sign-in attempts; wait a minute and try again');
  }
}
