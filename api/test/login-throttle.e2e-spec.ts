import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { In } from 'typeorm';
import { User } from '../src/users/entities/user.entity';
import { createTestApp, type TestApp } from './support/test-app';
import { createUser, runTag } from './support/users';

// Two API processes as behind a load balancer: TRUST_PROXY, so that each test can come from its
// own address (X-Forwarded-For) and meet no other suite's counts in the shared Redis.
const ADDRESS_LIMIT = 6;
const ACCOUNT_LIMIT = 4;
const ENV = {
  TRUST_PROXY: 'true',
  LOGIN_THROTTLE_ADDRESS_LIMIT: String(ADDRESS_LIMIT),
  LOGIN_THROTTLE_ACCOUNT_LIMIT: String(ACCOUNT_LIMIT),
  // Long enough that no window ends during the file.
  LOGIN_THROTTLE_TTL_SECONDS: '900',
};

const tag = runTag();
let addresses = 0;
/** A documentation IPv6 address in a /64 of its own (the limit counts a /64 as one address). */
const newAddress = () => `2001:db8:${tag.slice(0, 4)}:${(addresses += 1).toString(16)}::7`;
const unknownEmail = (n: number | string) => `nobody-${tag}-${n}@halvorsen.example`;

function attempt(app: TestApp, from: string, email: string, password = 'a wrong guess') {
  return app.http().post('/api/auth/login').set('X-Forwarded-For', from).send({ email, password });
}

describe('sign-in limits, shared by every API process', () => {
  let a: TestApp;
  let b: TestApp;
  let fresh: User;

  beforeAll(async () => {
    [a, b] = await Promise.all([createTestApp(ENV), createTestApp(ENV)]);
    fresh = await createUser(a.db, `throttle-${tag}`);
  });
  afterAll(async () => {
    await a.db.getRepository(User).delete({ id: In([fresh.id]) });
    await Promise.all([a.close(), b.close()]);
  });

  it('many different e-mails from one address get 429 after the address limit, saying which limit and when to retry', async () => {
    const from = newAddress();
    for (let i = 0; i < ADDRESS_LIMIT; i++) expect((await attempt(a, from, unknownEmail(`spray-${i}`))).status).toBe(401);
    const blocked = await attempt(a, from, unknownEmail('spray-last'));
    expect(blocked.status).toBe(429);
    expect(blocked.body.message).toMatch(new RegExp(`Too many sign-in attempts from your address \\(at most ${ADDRESS_LIMIT} in 900 s`));
    const retryAfter = Number(blocked.headers['retry-after']);
    expect(Number.isInteger(retryAfter)).toBe(true);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(900);
    expect(blocked.body.message).toContain(`try again in ${retryAfter} s`);
    // Even the right password is refused from that address now; from another it works.
    expect((await attempt(a, from, fresh.email, 'inflaton-demo-1')).status).toBe(429);
    expect((await attempt(a, newAddress(), fresh.email, 'inflaton-demo-1')).status).toBe(200);
  });

  it('one account tried from many addresses gets 429 after the account limit; other accounts are not affected', async () => {
    const target = unknownEmail('target');
    for (let i = 0; i < ACCOUNT_LIMIT; i++) expect((await attempt(a, newAddress(), target)).status).toBe(401);
    const from = newAddress();
    const blocked = await attempt(a, from, target);
    expect(blocked.status).toBe(429);
    expect(blocked.body.message).toMatch(new RegExp(`Too many sign-in attempts for this account \\(at most ${ACCOUNT_LIMIT} in 900 s`));
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);
    // The same address may still try another account.
    expect((await attempt(a, from, unknownEmail('bystander'))).status).toBe(401);
    // The e-mail is counted as accounts are looked up: case and spaces do not make a new one.
    expect((await attempt(a, newAddress(), `  ${target.toUpperCase()} `)).status).toBe(429);
  });

  it('counts attempts made through two API processes together', async () => {
    const from = newAddress();
    // Alternating between the processes: each sees only half the attempts, the limit all of them.
    for (let i = 0; i < ADDRESS_LIMIT; i++) {
      const app = i % 2 === 0 ? a : b;
      expect((await attempt(app, from, unknownEmail(`shared-${i}`))).status).toBe(401);
    }
    expect((await attempt(a, from, unknownEmail('shared-a'))).status).toBe(429);
    expect((await attempt(b, from, unknownEmail('shared-b'))).status).toBe(429);

    const target = unknownEmail('shared-target');
    for (let i = 0; i < ACCOUNT_LIMIT; i++) {
      const app = i % 2 === 0 ? b : a;
      expect((await attempt(app, newAddress(), target)).status).toBe(401);
    }
    expect((await attempt(b, newAddress(), target)).status).toBe(429);
  });
});

describe('password checks at once', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ TRUST_PROXY: 'true', PASSWORD_CHECK_CONCURRENCY: '1', PASSWORD_CHECK_QUEUE: '1' });
  });
  afterAll(() => t.close());

  it('past the bound, a sign-in is refused with 503 and a message instead of waiting its turn', async () => {
    // Twelve at once, each from its own address and e-mail so that no sign-in limit applies: one
    // argon2id check runs, one waits, and the others cannot all have waited behind them.
    const answers = await Promise.all(Array.from({ length: 12 }, (_, i) => attempt(t, newAddress(), unknownEmail(`flood-${i}`))));
    const statuses = answers.map((r) => r.status);
    expect(statuses.every((s) => s === 401 || s === 503)).toBe(true);
    expect(statuses.filter((s) => s === 401).length).toBeGreaterThanOrEqual(2);
    const busy = answers.find((r) => r.status === 503);
    expect(busy?.body.message).toBe('The server is busy checking other passwords; try again in a few seconds');
    // Once the flood is over, sign-ins are checked again.
    expect((await attempt(t, newAddress(), unknownEmail('after-flood'))).status).toBe(401);
  });
});
