import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import type request from 'supertest';
import { readAppConfig } from '../src/config/app.config';
import { readInvitationConfig } from '../src/config/invitation.config';
import { AuditEvent } from '../src/audit/entities/audit-event.entity';
import { Group } from '../src/groups/entities/group.entity';
import { Membership } from '../src/groups/entities/membership.entity';
import { Invitation } from '../src/invitations/entities/invitation.entity';
import { signInvitationToken } from '../src/invitations/invitation-token';
import { Notification } from '../src/notifications/entities/notification.entity';
import { User } from '../src/users/entities/user.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';

type Agent = ReturnType<typeof request.agent>;

describe('groups, invitations by e-mail and member roles', () => {
  let t: TestApp;
  let admin: Agent;
  let lead: Agent;
  let groupId: number;
  const stamp = Date.now();
  const newcomer = `newcomer-${stamp}@halvorsen.example`;

  /** The invitation e-mail to `to` as the local mail catcher received it, and the token in its link. */
  async function invitationMail(to: string) {
    const list = await admin.get('/api/admin/outbox').query({ to });
    expect(list.status).toBe(200);
    expect(list.body.total).toBeGreaterThan(0);
    const message = await admin.get(`/api/admin/outbox/${list.body.items[0].id}`);
    expect(message.status).toBe(200);
    const link = /(http\S+\/invitations\/([\w.-]+))/.exec(message.body.text as string);
    expect(link).not.toBeNull();
    return { text: message.body.text as string, html: message.body.html as string, link: link![1], token: link![2] };
  }

  const auditOf = (action: string, targetId: number | string) =>
    t.db.getRepository(AuditEvent).find({ where: { action, targetId: String(targetId) }, order: { id: 'ASC' } });

  beforeAll(async () => {
    t = await createTestApp();
    admin = await t.signIn(DEMO.admin);
    lead = await t.signIn(DEMO.plateauLead);
  });
  afterAll(async () => {
    if (groupId) await t.db.getRepository(Group).delete({ id: groupId });
    await t.db.getRepository(User).delete({ email: newcomer });
    await t.close();
  });

  it('lets a site admin create and edit a group, with audit rows', async () => {
    const created = await admin.post('/api/groups').send({ name: `Reheating Studies ${stamp}`, description: 'after inflation ends' });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ slug: `reheating-studies-${stamp}`, pointLimit: 1_000_000, members: [] });
    groupId = created.body.id;
    const again = await admin.post('/api/groups').send({ name: `Reheating Studies ${stamp}` });
    expect(again.status).toBe(409);
    const bad = await admin.post('/api/groups').send({ name: 'x', pointLimit: 0 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.fieldErrors).sort()).toEqual(['name', 'pointLimit']);

    const edited = await admin.patch(`/api/groups/${groupId}`).send({ pointLimit: 5000 });
    expect(edited.status).toBe(200);
    expect(edited.body.pointLimit).toBe(5000);
    expect((await t.db.getRepository(Group).findOneByOrFail({ id: groupId })).pointLimit).toBe(5000);
    expect(await auditOf('group.create', groupId)).toHaveLength(1);
    const [update] = await auditOf('group.update', groupId);
    expect(update.details).toMatchObject({ from: { pointLimit: 1_000_000 }, to: { pointLimit: 5000 } });
  });

  it('invites an existing account, which must be signed in as that address to join', async () => {
    const invited = await admin.post(`/api/groups/${groupId}/invitations`).send({ email: ' Henrik.Solberg@halvorsen.example ', role: 'lead' });
    expect(invited.status).toBe(201);
    const henrik = await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauLead });
    expect(invited.body).toMatchObject({ email: DEMO.plateauLead, role: 'lead', invitedByName: 'Amara Okafor', inviteeUserId: henrik.id });

    const mail = await invitationMail(DEMO.plateauLead);
    // An existing account is also told in the app, and the invitation mail stays its only e-mail.
    const notices = await t.db.getRepository(Notification).findBy({ userId: henrik.id, eventKey: `invitation-${invited.body.id}` });
    expect(notices).toEqual([expect.objectContaining({ kind: 'invited', emailedAt: expect.any(Date) })]);
    expect(notices[0].payload).toMatchObject({ link: `/invitations/${mail.token}`, groupId });
    const preview = await t.http().get(`/api/invitations/${mail.token}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ groupName: `Reheating Studies ${stamp}`, role: 'lead', email: DEMO.plateauLead, accountExists: true });

    const anonymous = await t.agent().post(`/api/invitations/${mail.token}/accept`).send({});
    expect(anonymous.status).toBe(401);
    expect(anonymous.body.message).toContain(`Sign in as ${DEMO.plateauLead} first`);
    const someoneElse = await (await t.signIn(DEMO.plateauMember)).post(`/api/invitations/${mail.token}/accept`).send({});
    expect(someoneElse.status).toBe(403);

    const joined = await lead.post(`/api/invitations/${mail.token}/accept`).send({});
    expect(joined.status).toBe(201);
    expect(joined.body.memberships).toContainEqual(expect.objectContaining({ groupId, role: 'lead' }));
    expect(await t.db.getRepository(Membership).findOneBy({ groupId, userId: henrik.id })).toMatchObject({ role: 'lead' });

    const reused = await lead.post(`/api/invitations/${mail.token}/accept`).send({});
    expect(reused.status).toBe(410);
    expect(reused.body.message).toContain('already accepted');
    expect((await t.http().get(`/api/invitations/${mail.token}`)).status).toBe(410);
    expect(await auditOf('membership.invite', invited.body.id)).toHaveLength(1);
    const [join] = await auditOf('membership.join', invited.body.id);
    expect(join).toMatchObject({ actorId: henrik.id, groupId });
  });

  it('sends a new address an e-mail whose link creates the account and signs it in', async () => {
    const invited = await lead.post(`/api/groups/${groupId}/invitations`).send({ email: newcomer, role: 'member' });
    expect(invited.status).toBe(201);
    expect(invited.body.inviteeUserId).toBeNull();
    const mail = await invitationMail(newcomer);
    expect(mail.text).toContain(`Reheating Studies ${stamp}`);
    expect(mail.text).toContain('Henrik Solberg');
    expect(mail.text).toContain('Your role will be member');
    expect(mail.html).toContain(mail.link);
    expect(mail.link.startsWith(process.env.APP_URL ?? 'http')).toBe(true);

    const preview = await t.http().get(`/api/invitations/${mail.token}`);
    expect(preview.body).toMatchObject({ email: newcomer, accountExists: false, invitedByName: 'Henrik Solberg' });

    const person = t.agent();
    const missing = await person.post(`/api/invitations/${mail.token}/accept`).send({ displayName: 'Noor' });
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.body.fieldErrors)).toEqual(['password']);
    const accepted = await person.post(`/api/invitations/${mail.token}/accept`).send({ displayName: 'Noor Haddad', password: 'slow-roll-plateau-9' });
    expect(accepted.status).toBe(201);
    expect(accepted.body).toMatchObject({ email: newcomer, displayName: 'Noor Haddad', siteRole: 'user' });
    const me = await person.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.memberships).toEqual([expect.objectContaining({ groupId, role: 'member' })]);
    // The chosen password signs in afresh.
    await t.signIn(newcomer, 'slow-roll-plateau-9');
    const [join] = await auditOf('membership.join', invited.body.id);
    expect(join.details).toMatchObject({ accountCreated: true, role: 'member' });

    const again = await lead.post(`/api/groups/${groupId}/invitations`).send({ email: newcomer, role: 'viewer' });
    expect(again.status).toBe(409);
  });

  it('replaces a pending invitation when the address is invited again, and revokes on request', async () => {
    const email = `pending-${stamp}@halvorsen.example`;
    const first = await lead.post(`/api/groups/${groupId}/invitations`).send({ email, role: 'viewer' });
    const firstToken = (await invitationMail(email)).token;
    const second = await lead.post(`/api/groups/${groupId}/invitations`).send({ email, role: 'member' });
    expect(second.status).toBe(201);
    const secondToken = (await invitationMail(email)).token;
    expect(secondToken).not.toBe(firstToken);
    expect((await t.http().get(`/api/invitations/${firstToken}`)).status).toBe(410);
    const pending = await lead.get(`/api/groups/${groupId}/invitations`);
    expect(pending.body.filter((i: { email: string }) => i.email === email)).toEqual([expect.objectContaining({ id: second.body.id, role: 'member' })]);
    expect((await auditOf('membership.invite', second.body.id))[0].details).toMatchObject({ replaced: [first.body.id] });

    const revoked = await lead.delete(`/api/groups/${groupId}/invitations/${second.body.id}`).set('content-type', 'application/json').send('{}');
    expect(revoked.status).toBe(204);
    const gone = await t.http().get(`/api/invitations/${secondToken}`);
    expect(gone.status).toBe(410);
    expect(gone.body.message).toContain('withdrawn');
    expect((await t.db.getRepository(Invitation).findOneByOrFail({ id: second.body.id })).revokedAt).not.toBeNull();
    expect(await auditOf('membership.invite_revoke', second.body.id)).toHaveLength(1);
    const twice = await lead.delete(`/api/groups/${groupId}/invitations/${second.body.id}`).set('content-type', 'application/json').send('{}');
    expect(twice.status).toBe(409);
  });

  it('refuses tampered and expired links with a reason', async () => {
    const email = `expiring-${stamp}@halvorsen.example`;
    const invited = await lead.post(`/api/groups/${groupId}/invitations`).send({ email, role: 'viewer' });
    const { token } = await invitationMail(email);
    const [id, expiry, signature] = token.split('.');
    const flipped = signature.at(-1) === 'A' ? 'B' : 'A';
    for (const bad of [`${id}.${expiry}.${signature.slice(0, -1)}${flipped}`, `${id}.${Number(expiry) + 86_400_000}.${signature}`, 'not-a-token']) {
      const res = await t.http().get(`/api/invitations/${bad}`);
      expect({ bad, status: res.status }).toEqual({ bad, status: 404 });
      expect(res.body.message).toContain('not valid');
    }
    // Backdate the invitation and sign its link as the API would have.
    const past = new Date(Date.now() - 60_000);
    await t.db.getRepository(Invitation).update({ id: invited.body.id }, { expiresAt: past });
    const secret = readInvitationConfig().secret ?? readAppConfig().sessionSecret;
    const expired = await t.agent().post(`/api/invitations/${signInvitationToken(secret, invited.body.id, past)}/accept`).send({ displayName: 'Late', password: 'too-late-for-this-1' });
    expect(expired.status).toBe(410);
    expect(expired.body.message).toContain('expired');
    expect(await t.db.getRepository(User).existsBy({ email })).toBe(false);
  });

  it('keeps the last lead: no demotion, no removal, no leaving; audits role changes and removals', async () => {
    const henrik = await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauLead });
    const noor = await t.db.getRepository(User).findOneByOrFail({ email: newcomer });
    const demote = await lead.patch(`/api/groups/${groupId}/members/${henrik.id}`).send({ role: 'member' });
    expect(demote.status).toBe(409);
    expect(demote.body.message).toBe(`Henrik Solberg is the last lead of Reheating Studies ${stamp} and cannot be demoted; make someone else lead first`);
    const leave = await lead.delete(`/api/groups/${groupId}/members/${henrik.id}`).set('content-type', 'application/json').send('{}');
    expect(leave.status).toBe(409);
    expect(leave.body.message).toContain('cannot leave it');
    const byAdmin = await admin.delete(`/api/groups/${groupId}/members/${henrik.id}`).set('content-type', 'application/json').send('{}');
    expect(byAdmin.status).toBe(409);

    const noorAgent = await t.signIn(newcomer, 'slow-roll-plateau-9');
    const memberTries = await noorAgent.patch(`/api/groups/${groupId}/members/${henrik.id}`).send({ role: 'viewer' });
    expect(memberTries.status).toBe(403);
    expect((await noorAgent.delete(`/api/groups/${groupId}/members/${henrik.id}`).set('content-type', 'application/json').send('{}')).status).toBe(403);

    const promote = await lead.patch(`/api/groups/${groupId}/members/${noor.id}`).send({ role: 'lead' });
    expect(promote.status).toBe(200);
    expect(promote.body).toMatchObject({ userId: noor.id, role: 'lead' });
    const [change] = await t.db.getRepository(AuditEvent).find({ where: { action: 'membership.role_change', groupId, targetId: String(noor.id) } });
    expect(change).toMatchObject({ actorId: henrik.id, details: expect.objectContaining({ from: 'member', to: 'lead' }) });

    const left = await lead.delete(`/api/groups/${groupId}/members/${henrik.id}`).set('content-type', 'application/json').send('{}');
    expect(left.status).toBe(204);
    expect(await t.db.getRepository(Membership).existsBy({ groupId, userId: henrik.id })).toBe(false);
    expect((await lead.get(`/api/groups/${groupId}`)).status).toBe(404);
    const removals = await t.db.getRepository(AuditEvent).find({ where: { action: 'membership.remove', groupId } });
    expect(removals).toEqual([expect.objectContaining({ actorId: henrik.id, targetId: String(henrik.id), details: expect.objectContaining({ self: true, role: 'lead' }) })]);
    const lastNow = await noorAgent.patch(`/api/groups/${groupId}/members/${noor.id}`).send({ role: 'viewer' });
    expect(lastNow.status).toBe(409);
    expect(lastNow.body.message).toContain('Noor Haddad is the last lead');
  });
});

describe('an invitation whose e-mail cannot be sent', () => {
  let t: TestApp;
  beforeAll(async () => {
    // Nothing listens on port 9: the mail server "refuses" every message.
    t = await createTestApp({ SMTP_PORT: '9' });
  });
  afterAll(() => t.close());

  it('answers 502 and keeps no invitation', async () => {
    const email = `unsent-${Date.now()}@halvorsen.example`;
    const plateau = await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' });
    const lead = await t.signIn(DEMO.plateauLead);
    const res = await lead.post(`/api/groups/${plateau.id}/invitations`).send({ email, role: 'viewer' });
    expect(res.status).toBe(502);
    expect(res.body.message).toContain('mail server refused');
    expect(await t.db.getRepository(Invitation).existsBy({ email })).toBe(false);
    const audited = await t.db.query("SELECT COUNT(*) AS n FROM audit_events WHERE action = 'membership.invite' AND JSON_VALUE(details, '$.email') = ?", [email]);
    expect(Number(audited[0].n)).toBe(0);
  });
});
