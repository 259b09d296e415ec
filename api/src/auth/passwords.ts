import { ServiceUnavailableException } from '@nestjs/common';
import { Sema } from 'async-sema';
import argon2 from 'argon2';

/**
 * argon2id takes 64 MiB and tens of milliseconds of a core per check, so a flood of sign-ins
 * could take all memory and CPU. At most `concurrency` checks and hashes run at once in this
 * process; up to `queue` more wait for a turn, and beyond that the request is refused at once
 * (503) rather than queued without end. The API sets the sizes at boot (PASSWORD_CHECK_*).
 */
let gate = { sema: new Sema(4), queue: 32 };

export function limitPasswordChecks(concurrency: number, queue: number): void {
  gate = { sema: new Sema(concurrency), queue };
}

async function oneAtATime<T>(work: () => Promise<T>): Promise<T> {
  const { sema, queue } = gate;
  const token = sema.tryAcquire();
  if (token === undefined) {
    if (sema.nrWaiting() >= queue) {
      throw new ServiceUnavailableException('The server is busy checking other passwords; try again in a few seconds');
    }
    await sema.acquire();
  }
  try {
    return await work();
  } finally {
    sema.release();
  }
}

// argon2id with the library's defaults (64 MiB, t=3), per the OWASP password storage cheat sheet.
export function hashPassword(plain: string): Promise<string> {
  return oneAtATime(() => argon2.hash(plain, { type: argon2.argon2id }));
}

export function verifyPassword(hash: string, plain: string): Promise<boolean> {
  return oneAtATime(() => argon2.verify(hash, plain).catch(() => false));
}

// Verifying against a real hash when the e-mail is unknown makes both failures take as long.
// The hash itself is made once, outside the limit, so that a refusal can never be cached here.
let unknownUserHash: Promise<string> | undefined;

export async function burnVerification(plain: string): Promise<false> {
  unknownUserHash ??= argon2.hash('no account has this password', { type: argon2.argon2id });
  await verifyPassword(await unknownUserHash, plain);
  return false;
}
