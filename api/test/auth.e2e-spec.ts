import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { AuditEvent } from '../src/audit/entities/audit-event.entity';
import { readRedisConfig } from '../src/config/redis.config';
import { createRedisClient, type RedisClient } from '../src/redis/redis-client';
import { createTestApp, DEMO, type TestApp } from './support/test-app';

const sessionKeys = async (redis: RedisClient) => redis.keys('sixtyfold:sess:*');

function sessionCookie(res: { headers: Record<string, unknown> }): string {
  const cookies = (res.headers['set-cookie'] as string[] | undefined) ?? [];
  const cookie = cookies.find((c) => c.startsWith('sixtyfold.sid='));
  if (!cookie) throw new Error(`no session cookie in ${JSON.stringify(cookies)}`);
  return cookie;
}

describe('sign-in, sign-out and sessions', () => {
  let t: TestApp;
  let redis: RedisClient;

  beforeAll(async () => {
    t = await createTestApp();
    redis = await createRedisClient(readRedisConfig());
  });
  afterAll(async () => {
    await redis.quit();
    await t.close();
  });

  it('signs in, keeps the session in Redis with a safe cookie, and signs out', async () => {
    const agent = t.agent();
    const before = await sessionKeys(redis);
    const login = await agent.post('/api/auth/login').send({ email: DEMO.plateauMember, password: 'inflaton-demo-1' });
    expect(login.status).toBe(200);
    expect(login.body).toMatchObject({
      email: DEMO.plateauMember,
      displayName: 'Lucía Marín',
      siteRole: 'user',
      memberships: [{ groupSlug: 'plateau-models', role: 'member' }],
    });
    expect(login.body).not.toHaveProperty('passwordHash');
    const cookie = sessionCookie(login);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/); // plain HTTP here; 'auto' sets Secure behind TLS
    const after = await sessionKeys(redis);
    expect(after.length).toBe(before.length + 1);

    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.email).toBe(DEMO.plateauMember);

    const logout = await agent.post('/api/auth/logout').set('content-type', 'application/json').send('{}');
    expect(logout.status).toBe(204);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
    expect((await sessionKeys(redis)).length).toBe(before.length);
  });

  it('accepts the e-mail in any case and with spaces around it', async () => {
    const res = await t.http().post('/api/auth/login').send({ email: '  Lucia.Marin@Halvorsen.Example ', password: 'inflaton-demo-1' });
    expect(res.status).toBe(200);
    expect(res.body.email).toBe(DEMO.plateauMember);
  });

  it('refuses a wrong password and an unknown e-mail alike, and records both', async () => {
    const wrong = await t.http().post('/api/auth/login').send({ email: DEMO.plateauViewer, password: 'not-the-password' });
    const unknown = await t.http().post('/api/auth/login').send({ email: 'nobody@halvorsen.example', password: 'whatever' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.message).toBe('E-mail or password is wrong');
    expect(unknown.body.message).toBe(wrong.body.message);
    expect(wrong.headers['set-cookie']).toBeUndefined();
    const failures = await t.db.getRepository(AuditEvent).find({ where: { action: 'auth.login_failed' } });
    const emails = failures.map((e) => e.details.email);
    expect(emails).toEqual(expect.arrayContaining([DEMO.plateauViewer, 'nobody@halvorsen.example']));
  });

  it('answers 400 with the field at fault for a malformed sign-in body', async () => {
    const res = await t.http().post('/api/auth/login').send({ email: 'not-an-address' });
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors).toEqual({
      email: ['Enter an e-mail address like name@institute.example'],
      password: ['Enter your password'],
    });
    const broken = await t.http().post('/api/auth/login').set('content-type', 'application/json').send('{"email": ');
    expect(broken.status).toBe(400);
    expect(broken.body.message).toMatch(/JSON/);
  });

  it('gives a new session id at sign-in, and the old one stops working', async () => {
    const agent = t.agent();
    const first = await agent.post('/api/auth/login').send({ email: DEMO.plateauLead, password: 'inflaton-demo-1' });
    const firstCookie = sessionCookie(first).split(';')[0];
    const second = await agent.post('/api/auth/login').send({ email: DEMO.plateauViewer, password: 'inflaton-demo-1' });
    const secondCookie = sessionCookie(second).split(';')[0];
    expect(secondCookie).not.toBe(firstCookie);
    expect((await agent.get('/api/auth/me')).body.email).toBe(DEMO.plateauViewer);
    const stale = await t.http().get('/api/auth/me').set('cookie', firstCookie);
    expect(stale.status).toBe(401);
  });

  it('refuses cross-site and non-JSON state changes (CSRF)', async () => {
    const agent = await t.signIn(DEMO.plateauMember);
    const form = await agent.post('/api/auth/logout').set('content-type', 'text/plain').send('x');
    expect(form.status).toBe(415);
    const foreign = await agent.post('/api/auth/logout').set('origin', 'https://elsewhere.example').send({});
    expect(foreign.status).toBe(403);
    const crossSite = await agent.post('/api/auth/logout').set('sec-fetch-site', 'cross-site').send({});
    expect(crossSite.status).toBe(403);
    expect((await agent.get('/api/auth/me')).status).toBe(200); // still signed in
    const sameOrigin = await agent.post('/api/auth/logout').set('sec-fetch-site', 'same-origin').send({});
    expect(sameOrigin.status).toBe(204);
  });

  it('sends security headers', async () => {
    const res = await t.http().get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'ok', database: 'up', redis: 'up' });
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});

describe('session expiry', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ SESSION_TTL_SECONDS: '2' });
  });
  afterAll(() => t.close());

  it('ends an idle session after SESSION_TTL_SECONDS', async () => {
    const agent = await t.signIn(DEMO.tensorMember);
    expect((await agent.get('/api/auth/me')).status).toBe(200);
    await new Promise((r) => setTimeout(r, 3_000));
    const expired = await agent.get('/api/auth/me');
    expect(expired.status).toBe(401);
    expect(expired.body.message).toMatch(/session is missing or has expired/);
  });
});
