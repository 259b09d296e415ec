import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { createHash } from 'node:crypto';
import type { Test } from 'supertest';
import { In } from 'typeorm';
import { AuditEvent } from '../src/audit/entities/audit-event.entity';
import { Group } from '../src/groups/entities/group.entity';
import { Membership } from '../src/groups/entities/membership.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { ApiToken } from '../src/tokens/entities/api-token.entity';
import { User } from '../src/users/entities/user.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
const DAY_MS = 86_400_000;

describe('personal API tokens', () => {
  let t: TestApp;
  let plateauId: number;
  let member: Agent;
  let luciaId: number;
  const scansMade: number[] = [];

  const smallScan = (name: string) => ({
    groupId: plateauId, name, model: { kind: 'family', family: 'starobinsky' },
    axes: [{ kind: 'list', parameter: 'nStar', values: [55] }], pivot: { kind: 'fixed' }, method: 'slowroll',
  });
  const bearer = (token: string) => ({ authorization: `Bearer ${token}` });

  async function createToken(agent: Agent, body: Record<string, unknown> = { name: 'notebook' }) {
    const res = await agent.post('/api/tokens').send(body);
    if (res.status !== 201) throw new Error(`POST /api/tokens answered ${res.status}: ${JSON.stringify(res.body)}`);
    return res.body as { id: number; token: string; prefix: string; expiresAt: string; lastUsedAt: string | null; readOnly: boolean };
  }

  beforeAll(async () => {
    t = await createTestApp();
    plateauId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    member = await t.signIn(DEMO.plateauMember);
    luciaId = (await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauMember })).id;
  });
  afterAll(async () => {
    if (scansMade.length) await t.db.getRepository(Scan).delete({ id: In(scansMade) });
    await t.close();
  });

  it('creates a token once, stores only its hash, and acts as its user on GET and POST', async () => {
    const created = await member.post('/api/tokens').send({ name: '  analysis notebook ', expiresInDays: 30 });
    expect(created.status).toBe(201);
    const { token, prefix, id } = created.body as { token: string; prefix: string; id: number };
    expect(token).toMatch(/^sfy_[A-Za-z0-9_-]{43}$/);
    expect(prefix).toBe(token.slice(0, 12));
    expect(created.body).toMatchObject({ name: 'analysis notebook', lastUsedAt: null });
    const lifetime = Date.parse(created.body.expiresAt) - Date.now();
    expect(lifetime).toBeGreaterThan(30 * DAY_MS - 60_000);
    expect(lifetime).toBeLessThanOrEqual(30 * DAY_MS);

    // Only the SHA-256 of the token is stored; no column holds the secret.
    const row = await t.db.getRepository(ApiToken).createQueryBuilder('k').addSelect('k.tokenHash').where('k.id = :id', { id }).getOneOrFail();
    expect(row.tokenHash).toBe(createHash('sha256').update(token).digest('hex'));
    expect(JSON.stringify(row)).not.toContain(token.slice(12));

    const me = await t.http().get('/api/auth/me').set(bearer(token));
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ email: DEMO.plateauMember, memberships: [{ groupId: plateauId, role: 'member' }] });

    const list = await t.http().get('/api/scans').set(bearer(token));
    expect(list.status).toBe(200);
    expect(Array.isArray(list.body.items)).toBe(true);

    // A script sends no cookie, no Origin and no Sec-Fetch headers: only the token.
    const posted = await t.http().post('/api/scans').set(bearer(token)).send(smallScan('submitted with a token'));
    expect(posted.status).toBe(201);
    scansMade.push(posted.body.id);
    expect(posted.body).toMatchObject({ ownerId: luciaId, status: 'queued', totalPoints: 1 });
    // No session is created for a bearer request.
    expect(posted.headers['set-cookie']).toBeUndefined();

    const audit = await t.db.getRepository(AuditEvent).findOneByOrFail({ action: 'token.create', targetId: String(id) });
    expect(audit).toMatchObject({ actorId: luciaId, targetType: 'api_token' });
    expect(JSON.stringify(audit.details)).not.toContain(token);
  });

  it('lists my tokens with lastUsedAt, never the secret, and writes lastUsedAt at most once a minute', async () => {
    const { id, token } = await createToken(member, { name: 'usage check' });
    const before = (await member.get('/api/tokens')).body as { id: number; lastUsedAt: string | null }[];
    expect(before.find((k) => k.id === id)?.lastUsedAt).toBeNull();

    expect((await t.http().get('/api/scans').set(bearer(token))).status).toBe(200);
    const listed = await member.get('/api/tokens');
    expect(listed.status).toBe(200);
    const mine = (listed.body as Record<string, unknown>[]).find((k) => k.id === id)!;
    expect(Object.keys(mine).sort()).toEqual(['createdAt', 'expiresAt', 'id', 'lastUsedAt', 'name', 'prefix', 'readOnly']);
    expect(Date.parse(mine.expiresAt as string) - Date.now()).toBeGreaterThan(89 * DAY_MS);
    const firstUse = mine.lastUsedAt as string;
    expect(Date.now() - Date.parse(firstUse)).toBeLessThan(60_000);
    expect(JSON.stringify(listed.body)).not.toContain(token);

    expect((await t.http().get('/api/scans').set(bearer(token))).status).toBe(200);
    const again = (await member.get('/api/tokens')).body as { id: number; lastUsedAt: string }[];
    expect(again.find((k) => k.id === id)?.lastUsedAt).toBe(firstUse);
  });

  it('stops a revoked token at once, audits the revocation and drops it from the list', async () => {
    const { id, token } = await createToken(member, { name: 'to revoke' });
    expect((await t.http().get('/api/scans').set(bearer(token))).status).toBe(200);

    const revoked = await member.delete(`/api/tokens/${id}`).set('content-type', 'application/json').send('{}');
    expect(revoked.status).toBe(204);
    const refused = await t.http().get('/api/scans').set(bearer(token));
    expect(refused.status).toBe(401);
    expect(refused.body.message).toMatch(/revoked/);
    const list = (await member.get('/api/tokens')).body as { id: number }[];
    expect(list.map((k) => k.id)).not.toContain(id);
    expect(await t.db.getRepository(AuditEvent).countBy({ action: 'token.revoke', targetId: String(id) })).toBe(1);
    // Revoking twice finds nothing to revoke.
    expect((await member.delete(`/api/tokens/${id}`).set('content-type', 'application/json').send('{}')).status).toBe(404);
  });

  it('answers 401 with a reason for malformed, unknown and expired tokens', async () => {
    for (const header of ['Bearer', 'Bearer not-a-token', `Bearer sfy_${'a'.repeat(42)}`]) {
      const res = await t.http().get('/api/scans').set('authorization', header);
      expect({ header, status: res.status }).toEqual({ header, status: 401 });
      expect(res.body.message).toMatch(/not a Sixtyfold API token/);
    }
    const unknown = await t.http().get('/api/scans').set(bearer(`sfy_${'Q'.repeat(43)}`));
    expect(unknown.status).toBe(401);
    expect(unknown.body.message).toMatch(/Unknown API token/);

    const { id, token } = await createToken(member, { name: 'short-lived', expiresInDays: 1 });
    expect((await t.http().get('/api/scans').set(bearer(token))).status).toBe(200);
    await t.db.getRepository(ApiToken).update({ id }, { expiresAt: new Date(Date.now() - 1000) });
    const expired = await t.http().get('/api/scans').set(bearer(token));
    expect(expired.status).toBe(401);
    expect(expired.body.message).toMatch(/expired on/);
  });

  it('refuses bad token requests with the field at fault', async () => {
    const res = await member.post('/api/tokens').send({ name: ' ', expiresInDays: 0 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fieldErrors).sort()).toEqual(['expiresInDays', 'name']);
    const tooLong = await member.post('/api/tokens').send({ name: 'x', expiresInDays: 366 });
    expect(tooLong.status).toBe(400);
    expect(tooLong.body.fieldErrors.expiresInDays).toEqual(['a token lives at most 365 days']);
  });

  it("carries the user's current roles: a viewer's token cannot submit until the role changes", async () => {
    const viewer = await t.signIn(DEMO.plateauViewer);
    const { token } = await createToken(viewer, { name: 'viewer notebook' });
    expect((await t.http().get('/api/scans').set(bearer(token))).status).toBe(200);
    const refused = await t.http().post('/api/scans').set(bearer(token)).send(smallScan('viewer attempt'));
    expect(refused.status).toBe(403);
    expect(refused.body.message).toMatch(/member role/);

    // Roles are read on every request, so a promotion applies to the same token at once.
    const tomas = await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauViewer });
    const memberships = t.db.getRepository(Membership);
    await memberships.update({ userId: tomas.id, groupId: plateauId }, { role: 'member' });
    try {
      const accepted = await t.http().post('/api/scans').set(bearer(token)).send(smallScan('after promotion'));
      expect(accepted.status).toBe(201);
      scansMade.push(accepted.body.id);
    } finally {
      await memberships.update({ userId: tomas.id, groupId: plateauId }, { role: 'viewer' });
    }
  });

  it('authenticates a request by its bearer token alone, even next to a session cookie', async () => {
    const viewer = await t.signIn(DEMO.plateauViewer);
    const { token } = await createToken(viewer, { name: 'viewer, second' });
    const lead = await t.signIn(DEMO.plateauLead);
    // The lead's session cookie travels with the viewer's token: the token decides.
    const me = await lead.get('/api/auth/me').set(bearer(token));
    expect(me.body.email).toBe(DEMO.plateauViewer);
    expect((await lead.post('/api/scans').set(bearer(token)).send(smallScan('mixed credentials'))).status).toBe(403);
    expect((await lead.get('/api/auth/me')).body.email).toBe(DEMO.plateauLead);
  });

  it("does not let one user revoke another's token", async () => {
    const { id, token } = await createToken(member, { name: 'not yours' });
    const other = await t.signIn(DEMO.plateauViewer);
    const res = await other.delete(`/api/tokens/${id}`).set('content-type', 'application/json').send('{}');
    expect(res.status).toBe(404);
    expect(res.body.message).toBe('No such API token');
    expect(((await other.get('/api/tokens')).body as { id: number }[]).map((k) => k.id)).not.toContain(id);
    expect((await t.http().get('/api/scans').set(bearer(token))).status).toBe(200);
  });

  it('refuses token management, sign-in and sign-out with a bearer token', async () => {
    const { id, token } = await createToken(member, { name: 'cannot mint' });
    const count = await t.db.getRepository(ApiToken).countBy({ userId: luciaId });
    const attempts: [string, Test][] = [
      ['GET /api/tokens', t.http().get('/api/tokens').set(bearer(token))],
      ['POST /api/tokens', t.http().post('/api/tokens').set(bearer(token)).send({ name: 'minted by a token' })],
      ['DELETE /api/tokens/:id', t.http().delete(`/api/tokens/${id}`).set(bearer(token))],
      ['POST /api/auth/login', t.http().post('/api/auth/login').set(bearer(token)).send({ email: DEMO.plateauMember, password: 'inflaton-demo-1' })],
      ['POST /api/auth/logout', t.http().post('/api/auth/logout').set(bearer(token)).send({})],
    ];
    for (const [route, attempt] of attempts) {
      const res = await attempt;
      expect({ route, status: res.status }).toEqual({ route, status: 403 });
      expect(res.body.message).toMatch(/need a browser session/);
    }
    expect(await t.db.getRepository(ApiToken).countBy({ userId: luciaId })).toBe(count);
    expect((await t.http().get('/api/scans').set(bearer(token))).status).toBe(200); // not revoked either
  });
});
