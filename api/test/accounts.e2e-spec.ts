import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { Like } from 'typeorm';
import { AuditEvent } from '../src/audit/entities/audit-event.entity';
import { DEMO_PASSWORD } from '../src/database/seeds/demo-scenario';
import { Membership } from '../src/groups/entities/membership.entity';
import { AccountControls1796300000010 } from '../src/database/migrations/1796300000010-AccountControls';
import { ApiToken } from '../src/tokens/entities/api-token.entity';
import { User } from '../src/users/entities/user.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
const DAY_MS = 86_400_000;
const NEW_PASSWORD = 'a brand-new passphrase';

describe('accounts: passwords, disabling, token expiry and read-only tokens', () => {
  let t: TestApp;
  let admin: Agent;
  let demoHash: string;
  let adminId: number;

  /** A throwaway account with the demo password, so sign-in throttling and changes touch no demo account. */
  async function makeUser(name: string): Promise<User> {
    return t.db.getRepository(User).save({
      email: `accounts-${name}@halvorsen.example`, displayName: `Accounts test (${name})`, passwordHash: demoHash, siteRole: 'user',
    });
  }
  const bearer = (token: string) => ({ authorization: `Bearer ${token}` });
  async function createToken(agent: Agent, body: Record<string, unknown>) {
    const res = await agent.post('/api/tokens').send(body);
    if (res.status !== 201) throw new Error(`POST /api/tokens answered ${res.status}: ${JSON.stringify(res.body)}`);
    return res.body as { id: number; token: string; expiresAt: string; readOnly: boolean };
  }

  beforeAll(async () => {
    t = await createTestApp();
    const row = await t.db.getRepository(User).createQueryBuilder('u').addSelect('u.passwordHash').where('u.email = :e', { e: DEMO.admin }).getOneOrFail();
    demoHash = row.passwordHash;
    adminId = row.id;
    admin = await t.signIn(DEMO.admin);
  });
  afterAll(async () => {
    await t.db.getRepository(User).delete({ email: Like('accounts-%') });
    await t.close();
  });

  describe('changing my password', () => {
    it('needs the current password, ends my other sessions, keeps this one, and is audited', async () => {
      const user = await makeUser('password');
      const here = await t.signIn(user.email);
      const elsewhere = await t.signIn(user.email);

      const wrong = await here.post('/api/auth/password').send({ currentPassword: 'not my password', newPassword: NEW_PASSWORD });
      expect(wrong.status).toBe(400);
      expect(Object.keys(wrong.body.fieldErrors)).toEqual(['currentPassword']);
      expect(wrong.body.message).toMatch(/^currentPassword: /);
      // Nothing changed: both sessions still work.
      expect((await elsewhere.get('/api/auth/me')).status).toBe(200);

      const changed = await here.post('/api/auth/password').send({ currentPassword: DEMO_PASSWORD, newPassword: NEW_PASSWORD });
      expect(changed.status).toBe(204);
      const me = await here.get('/api/auth/me');
      expect(me.status).toBe(200);
      expect(me.body.email).toBe(user.email);
      const ended = await elsewhere.get('/api/auth/me');
      expect(ended.status).toBe(401);
      expect(ended.body.message).toMatch(/session has ended/);

      const oldPassword = await t.http().post('/api/auth/login').send({ email: user.email, password: DEMO_PASSWORD });
      expect(oldPassword.status).toBe(401);
      expect((await t.http().post('/api/auth/login').send({ email: user.email, password: NEW_PASSWORD })).status).toBe(200);
      expect(await t.db.getRepository(AuditEvent).countBy({ action: 'user.password_change', targetId: String(user.id), actorId: user.id })).toBe(1);
    });

    it('checks the new password with the shared rules and names the field', async () => {
      const user = await makeUser('password-rules');
      const agent = await t.signIn(user.email);
      const short = await agent.post('/api/auth/password').send({ currentPassword: DEMO_PASSWORD, newPassword: 'short' });
      expect(short.status).toBe(400);
      expect(short.body.fieldErrors).toEqual({ newPassword: ['Choose a password of at least 10 characters'] });
      const same = await agent.post('/api/auth/password').send({ currentPassword: DEMO_PASSWORD, newPassword: DEMO_PASSWORD });
      expect(same.status).toBe(400);
      expect(same.body.fieldErrors).toEqual({ newPassword: ['Choose a password different from the current one'] });
      expect((await agent.get('/api/auth/me')).status).toBe(200);
    });

    it('is refused to an API token', async () => {
      const user = await makeUser('password-token');
      const agent = await t.signIn(user.email);
      const { token } = await createToken(agent, { name: 'cannot change passwords' });
      const res = await t.http().post('/api/auth/password').set(bearer(token)).send({ currentPassword: DEMO_PASSWORD, newPassword: NEW_PASSWORD });
      expect(res.status).toBe(403);
      expect(res.body.message).toMatch(/need a browser session/);
      expect(await t.db.getRepository(AuditEvent).countBy({ action: 'user.password_change', targetId: String(user.id) })).toBe(0);
    });
  });

  describe('disabling an account', () => {
    it("ends the account's sessions, refuses its tokens and its sign-in; re-enabling restores sign-in", async () => {
      const user = await makeUser('disabled');
      const session = await t.signIn(user.email);
      const { token } = await createToken(session, { name: 'script' });
      expect((await t.http().get('/api/auth/me').set(bearer(token))).status).toBe(200);

      const disabled = await admin.post(`/api/admin/users/${user.id}/disable`).send({});
      expect(disabled.status).toBe(200);
      expect(disabled.body).toMatchObject({ id: user.id, email: user.email });
      expect(Date.parse(disabled.body.disabledAt)).not.toBeNaN();

      const sessionRefused = await session.get('/api/auth/me');
      expect(sessionRefused.status).toBe(401);
      expect(sessionRefused.body.message).toMatch(/disabled/);
      const tokenRefused = await t.http().get('/api/scans').set(bearer(token));
      expect(tokenRefused.status).toBe(401);
      expect(tokenRefused.body.message).toMatch(/account disabled/i);

      // A wrong password learns nothing; the right one is told the account is disabled.
      const guess = await t.http().post('/api/auth/login').send({ email: user.email, password: 'a wrong guess' });
      expect(guess.status).toBe(401);
      expect(guess.body.message).toBe('E-mail or password is wrong');
      const refused = await t.http().post('/api/auth/login').send({ email: user.email, password: DEMO_PASSWORD });
      expect(refused.status).toBe(403);
      expect(refused.body.message).toMatch(/disabled/);
      expect(refused.headers['set-cookie']).toBeUndefined();

      const listed = (await admin.get('/api/admin/users')).body as { id: number; disabledAt: string | null; lastLoginAt: string | null }[];
      const row = listed.find((u) => u.id === user.id)!;
      expect(row.disabledAt).toBe(disabled.body.disabledAt);
      expect(row.lastLoginAt).not.toBeNull();

      const enabled = await admin.post(`/api/admin/users/${user.id}/enable`).send({});
      expect(enabled.status).toBe(200);
      expect(enabled.body.disabledAt).toBeNull();
      // The token works again; the session ended at the disable and stays ended.
      expect((await t.http().get('/api/auth/me').set(bearer(token))).status).toBe(200);
      expect((await session.get('/api/auth/me')).status).toBe(401);
      expect((await t.http().post('/api/auth/login').send({ email: user.email, password: DEMO_PASSWORD })).status).toBe(200);

      const events = await t.db.getRepository(AuditEvent).find({ where: { targetType: 'user', targetId: String(user.id), actorId: adminId } });
      expect(events.map((e) => e.action).sort()).toEqual(['user.disable', 'user.enable']);
    });

    it('does not let an admin disable themselves, and answers 404 for an unknown account', async () => {
      const self = await admin.post(`/api/admin/users/${adminId}/disable`).send({});
      expect(self.status).toBe(409);
      expect(self.body.message).toMatch(/your own account/);
      expect((await admin.get('/api/auth/me')).status).toBe(200);
      expect((await admin.post('/api/admin/users/999999999/disable').send({})).status).toBe(404);
      expect((await admin.post('/api/admin/users/not-a-number/enable').send({})).status).toBe(400);
    });

    it('is for site admins only', async () => {
      const user = await makeUser('not-by-lead');
      const lead = await t.signIn(DEMO.plateauLead);
      const res = await lead.post(`/api/admin/users/${user.id}/disable`).send({});
      expect(res.status).toBe(403);
      expect((await t.db.getRepository(User).findOneByOrFail({ id: user.id })).disabledAt).toBeNull();
    });
  });

  describe('API token lifetime and read-only tokens', () => {
    it('gives a token 90 days unless asked, and refuses more than 365', async () => {
      const user = await makeUser('token-expiry');
      const agent = await t.signIn(user.email);
      const created = await createToken(agent, { name: 'default lifetime' });
      const lifetime = Date.parse(created.expiresAt) - Date.now();
      expect(lifetime).toBeGreaterThan(90 * DAY_MS - 60_000);
      expect(lifetime).toBeLessThanOrEqual(90 * DAY_MS);
      expect(created.readOnly).toBe(false);
      const year = await createToken(agent, { name: 'a year', expiresInDays: 365 });
      expect(Date.parse(year.expiresAt) - Date.now()).toBeGreaterThan(364 * DAY_MS);

      const tooLong = await agent.post('/api/tokens').send({ name: 'forever', expiresInDays: 366 });
      expect(tooLong.status).toBe(400);
      expect(tooLong.body.fieldErrors).toEqual({ expiresInDays: ['a token lives at most 365 days'] });
      const never = await agent.post('/api/tokens').send({ name: 'forever', expiresInDays: null });
      expect(never.status).toBe(400);
      expect(Object.keys(never.body.fieldErrors)).toEqual(['expiresInDays']);
    });

    it('refuses an expired token with 401', async () => {
      const user = await makeUser('token-expired');
      const agent = await t.signIn(user.email);
      const { id, token } = await createToken(agent, { name: 'short-lived', expiresInDays: 1 });
      expect((await t.http().get('/api/auth/me').set(bearer(token))).status).toBe(200);
      await t.db.getRepository(ApiToken).update({ id }, { expiresAt: new Date(Date.now() - 1000) });
      const expired = await t.http().get('/api/auth/me').set(bearer(token));
      expect(expired.status).toBe(401);
      expect(expired.body.message).toMatch(/expired on/);
    });

    it('lets a read-only token read but answers 403 to anything else, and lists it as read-only', async () => {
      const user = await makeUser('token-read-only');
      const agent = await t.signIn(user.email);
      const { id, token, readOnly } = await createToken(agent, { name: 'dashboard', readOnly: true });
      expect(readOnly).toBe(true);
      expect((await t.http().get('/api/auth/me').set(bearer(token))).status).toBe(200);
      expect((await t.http().head('/api/scans').set(bearer(token))).status).toBe(200);

      const posted = await t.http().post('/api/notifications/read-all').set(bearer(token)).send({});
      expect(posted.status).toBe(403);
      expect(posted.body.message).toMatch(/read-only/);
      const patched = await t.http().patch('/api/auth/me/preferences').set(bearer(token)).send({ notificationEmail: 'never' });
      expect(patched.status).toBe(403);
      expect((await t.db.getRepository(User).findOneByOrFail({ id: user.id })).notificationEmail).toBe('immediate');

      // The same request with a full token goes through.
      const full = await createToken(agent, { name: 'full access' });
      expect((await t.http().post('/api/notifications/read-all').set(bearer(full.token)).send({})).status).toBe(200);

      const listed = (await agent.get('/api/tokens')).body as { id: number; readOnly: boolean; expiresAt: string }[];
      expect(listed.find((k) => k.id === id)).toMatchObject({ readOnly: true });
      expect(listed.find((k) => k.id === full.id)).toMatchObject({ readOnly: false });
      const audit = await t.db.getRepository(AuditEvent).findOneByOrFail({ action: 'token.create', targetId: String(id) });
      expect(audit.details).toMatchObject({ readOnly: true });
    });
  });

  describe('the migration to expiring tokens', () => {
    it('gives tokens without an expiry one 90 days away, and makes tokens read-write', async () => {
      const user = await makeUser('token-migration');
      const migration = new AccountControls1796300000010();
      const runner = t.db.createQueryRunner();
      try {
        await migration.down(runner);
        await runner.query(
          'INSERT INTO `api_tokens` (`user_id`, `name`, `token_hash`, `prefix`, `expires_at`) VALUES (?, ?, ?, ?, NULL)',
          [user.id, 'from before expiry', 'f'.repeat(64), 'sfy_beforeXX'],
        );
        await migration.up(runner);
      } finally {
        await runner.release();
      }
      const row = await t.db.getRepository(ApiToken).findOneByOrFail({ userId: user.id, name: 'from before expiry' });
      const lifetime = row.expiresAt.getTime() - Date.now();
      expect(lifetime).toBeGreaterThan(89 * DAY_MS);
      expect(lifetime).toBeLessThanOrEqual(90 * DAY_MS + 60_000);
      expect(row.readOnly).toBe(false);
    });
  });
});

describe('seeding the demo scenario, and the first administrator without it', () => {
  const seed = (nodeEnv: string) =>
    spawnSync(process.execPath, [path.resolve('dist/database/seeds/run-seed.js')], {
      env: { ...process.env, NODE_ENV: nodeEnv }, encoding: 'utf8',
    });

  it('refuses with NODE_ENV=production and says why', () => {
    const result = seed('production');
    expect(result.status).not.toBe(0);
    expect(result.stderr).toMatch(/NODE_ENV is production/);
    expect(result.stdout).not.toMatch(/seeded/);
  });

  it('creates a site administrator from the command line, with the password on standard input', async () => {
    const createAdmin = (args: string[], password: string) =>
      spawnSync(process.execPath, [path.resolve('dist/database/seeds/create-admin.js'), ...args], {
        env: { ...process.env, NODE_ENV: 'production' }, input: `${password}\n`, encoding: 'utf8',
      });
    const email = 'accounts-operator@halvorsen.example';
    const short = createAdmin([email, 'Site Operator'], 'short');
    expect(short.status).not.toBe(0);
    expect(short.stderr).toMatch(/password: Choose a password of at least 10 characters/);

    const created = createAdmin([` ${email.toUpperCase()} `, 'Site Operator'], 'operator passphrase');
    expect(created.stderr).toBe('');
    expect(created.status).toBe(0);
    expect(created.stdout).toContain(`site administrator ${email} created`);
    const again = createAdmin([email, 'Site Operator'], 'operator passphrase');
    expect(again.status).not.toBe(0);
    expect(again.stderr).toMatch(/already has an account/);

    const t = await createTestApp();
    try {
      const agent = await t.signIn(email, 'operator passphrase');
      expect((await agent.get('/api/auth/me')).body).toMatchObject({ email, displayName: 'Site Operator', siteRole: 'admin' });
      expect((await agent.get('/api/admin/users')).status).toBe(200);
    } finally {
      await t.db.getRepository(User).delete({ email });
      await t.close();
    }
  });

  it('leaves a database that has accounts alone, even when a demo account is gone', async () => {
    const t = await createTestApp();
    const users = t.db.getRepository(User);
    const memberships = t.db.getRepository(Membership);
    // Someone removed a demo account: a start must not bring it back with the published password.
    const viewer = await users.createQueryBuilder('u').addSelect('u.passwordHash').where('u.email = :e', { e: DEMO.tensorViewer }).getOneOrFail();
    const viewerGroups = await memberships.findBy({ userId: viewer.id });
    await users.delete({ id: viewer.id });
    try {
      const before = await users.count();
      const result = seed('development');
      expect(result.status).toBe(0);
      expect(result.stdout).toContain('the database already has accounts: demo not seeded');
      expect(await users.count()).toBe(before);
      expect(await users.existsBy({ email: DEMO.tensorViewer })).toBe(false);
    } finally {
      // Put the account back for the other suites.
      const { id: _, ...fields } = viewer;
      const restored = await users.save(users.create(fields));
      for (const m of viewerGroups) await memberships.insert({ groupId: m.groupId, userId: restored.id, role: m.role });
      await t.close();
    }
  });
});
