import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import type request from 'supertest';
import { Group } from '../src/groups/entities/group.entity';
import { Notification } from '../src/notifications/entities/notification.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { scanLifecycle } from '../src/database/scan-lifecycle';
import { User } from '../src/users/entities/user.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { until } from './support/until';
import { storedSpec } from './support/stored-spec';

type Agent = ReturnType<typeof request.agent>;

// A one-second tick, so finished scans are announced promptly; the assertions wait for outcomes, never for time.
const ENV = { NOTIFY_INTERVAL_SECONDS: '1' };

describe('notifications and their e-mails', () => {
  let t: TestApp;
  let admin: Agent;
  let plateauId: number;
  const ids = new Map<string, number>();
  const stamp = Date.now();

  const mails = async (to: string, subjectPart: string) => {
    const res = await admin.get('/api/admin/outbox').query({ to, pageSize: 200 });
    expect(res.status).toBe(200);
    return (res.body.items as { id: string; subject: string }[]).filter((m) => m.subject.includes(subjectPart));
  };
  const notificationsFor = (email: string, eventKeyPart: string) =>
    t.db.getRepository(Notification).createQueryBuilder('n')
      .where('n.userId = :u AND n.eventKey LIKE :k', { u: ids.get(email), k: `%${eventKeyPart}%` })
      .getMany();

  /** A scan whose points are all stored, finished by the same SQL the worker runs. */
  const finishScan = async (ownerEmail: string, name: string, done: number, failed: number) => {
    const scan = await t.db.getRepository(Scan).save({
      groupId: plateauId, ownerId: ids.get(ownerEmail)!, name, method: 'slowroll', status: 'running', spec: storedSpec(plateauId), note: '',
      totalPoints: done + failed, donePoints: done, failedPoints: failed, queuedAt: new Date(), startedAt: new Date(),
    });
    await scanLifecycle.finishIfAllStored(t.db, scan.id);
    return scan.id;
  };

  beforeAll(async () => {
    t = await createTestApp(ENV);
    admin = await t.signIn(DEMO.admin);
    plateauId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    for (const email of Object.values(DEMO)) ids.set(email, (await t.db.getRepository(User).findOneByOrFail({ email })).id);
  });
  afterAll(async () => {
    await t.db.query("UPDATE users SET notification_email = 'immediate'");
    await t.close();
  });

  it('tells the owner once that a scan completed, by one e-mail, across ticks and a restart', async () => {
    const name = `Completion check ${stamp}`;
    const scanId = await finishScan(DEMO.plateauMember, name, 3, 1);
    const [mail] = await until(async () => ((await mails(DEMO.plateauMember, name)).length ? mails(DEMO.plateauMember, name) : undefined), 'the completion e-mail');
    const message = await admin.get(`/api/admin/outbox/${mail.id}`);
    expect(message.body.subject).toBe(`Sixtyfold: Scan "${name}" completed`);
    expect(message.body.text).toContain('3 point(s) computed, 1 failed');
    expect(message.body.text).toContain(`/scans/${scanId}`);
    expect(message.body.text).toMatch(/preference/);

    // Restart the API; a later finish being announced proves the ticks ran again.
    await t.close();
    t = await createTestApp(ENV);
    admin = await t.signIn(DEMO.admin);
    const later = `Completion later ${stamp}`;
    await finishScan(DEMO.plateauMember, later, 1, 0);
    await until(async () => ((await mails(DEMO.plateauMember, later)).length ? true : undefined), 'the later completion e-mail');

    expect(await mails(DEMO.plateauMember, name)).toHaveLength(1);
    const rows = await notificationsFor(DEMO.plateauMember, `scan-${scanId}-`);
    expect(rows.map((r) => r.kind)).toEqual(['scan_completed']);
    expect(rows[0].emailedAt).not.toBeNull();
    const member = await t.signIn(DEMO.plateauMember);
    const list = await member.get('/api/notifications').query({ pageSize: 200 });
    expect(list.body.items.filter((n: { payload: { scanId?: number } }) => n.payload.scanId === scanId)).toHaveLength(1);
  });

  it('tells the owner a scan failed (no usable point) or was cancelled, naming who cancelled', async () => {
    const failedName = `Failure check ${stamp}`;
    const failedId = await finishScan(DEMO.plateauMember, failedName, 0, 2);
    const cancelledName = `Cancel check ${stamp}`;
    const live = await t.db.getRepository(Scan).save({
      groupId: plateauId, ownerId: ids.get(DEMO.plateauMember)!, name: cancelledName, method: 'slowroll', status: 'queued', spec: storedSpec(plateauId), note: '', totalPoints: 1,
    });
    const lead = await t.signIn(DEMO.plateauLead);
    expect((await lead.post(`/api/scans/${live.id}/cancel`).send({})).status).toBe(200);

    await until(async () => ((await mails(DEMO.plateauMember, cancelledName)).length && (await mails(DEMO.plateauMember, failedName)).length ? true : undefined), 'both e-mails');
    expect((await notificationsFor(DEMO.plateauMember, `scan-${failedId}-`)).map((r) => r.kind)).toEqual(['scan_failed']);
    const cancelled = await notificationsFor(DEMO.plateauMember, `scan-${live.id}-`);
    expect(cancelled.map((r) => r.kind)).toEqual(['scan_cancelled']);
    expect(cancelled[0].payload.actorName).toBe('Henrik Solberg');
    expect(await mails(DEMO.plateauLead, cancelledName)).toHaveLength(0);
  });

  it('e-mails a mentioned member only, and on an edit only the newly mentioned', async () => {
    const name = `Mention check ${stamp}`;
    const scanId = await finishScan(DEMO.plateauLead, name, 1, 0);
    const lead = await t.signIn(DEMO.plateauLead);
    const posted = await lead.post(`/api/scans/${scanId}/comments`).send({ body: `@lucia.marin @mei.nakamura @henrik.solberg @nobody look at ${stamp}` });
    expect(posted.status).toBe(201);
    expect(posted.body.mentions.map((m: { handle: string }) => m.handle).sort()).toEqual(['henrik.solberg', 'lucia.marin']);

    const subject = `Henrik Solberg mentioned you on "${name}"`;
    await until(async () => ((await mails(DEMO.plateauMember, subject)).length ? true : undefined), 'the mention e-mail');
    const edited = await lead.patch(`/api/comments/${posted.body.id}`).send({ body: `@lucia.marin and now @tomas.reyes, ${stamp}` });
    expect(edited.status).toBe(200);
    expect(edited.body.edited).toBe(true);
    await until(async () => ((await mails(DEMO.plateauViewer, subject)).length ? true : undefined), 'the e-mail to the newly mentioned viewer');

    expect(await mails(DEMO.plateauMember, subject)).toHaveLength(1);
    expect(await mails(DEMO.plateauViewer, subject)).toHaveLength(1);
    expect(await mails(DEMO.tensorLead, subject)).toHaveLength(0);
    expect(await mails(DEMO.plateauLead, subject)).toHaveLength(0);
    expect(await notificationsFor(DEMO.tensorLead, `comment-${posted.body.id}-`)).toHaveLength(0);
    const mention = await notificationsFor(DEMO.plateauMember, `comment-${posted.body.id}-`);
    expect(mention.map((n) => [n.kind, n.payload.link])).toEqual([['mentioned', `/scans/${scanId}`]]);
  });

  it("sends nothing for 'never', and one digest of everything pending for 'daily'", async () => {
    const member = await t.signIn(DEMO.plateauMember);
    const viewer = await t.signIn(DEMO.plateauViewer);
    expect((await member.patch('/api/auth/me/preferences').send({ notificationEmail: 'never' })).body).toEqual({ notificationEmail: 'never' });
    expect((await viewer.patch('/api/auth/me/preferences').send({ notificationEmail: 'daily' })).status).toBe(200);
    expect((await viewer.get('/api/auth/me/preferences')).body).toEqual({ notificationEmail: 'daily' });
    expect((await viewer.patch('/api/auth/me/preferences').send({ notificationEmail: 'hourly' })).status).toBe(400);

    const quiet = `Quiet check ${stamp}`;
    const quietId = await finishScan(DEMO.plateauMember, quiet, 1, 0);
    const lead = await t.signIn(DEMO.plateauLead);
    const scanId = await finishScan(DEMO.plateauLead, `Digest check ${stamp}`, 1, 0);
    for (const n of [1, 2]) {
      expect((await lead.post(`/api/scans/${scanId}/comments`).send({ body: `@tomas.reyes digest item ${n} ${stamp}` })).status).toBe(201);
    }
    // A later announcement for someone else proves the tick has handled the quiet scan too.
    const marker = `Marker check ${stamp}`;
    await finishScan(DEMO.plateauLead, marker, 1, 0);
    await until(async () => ((await mails(DEMO.plateauLead, marker)).length ? true : undefined), 'the marker e-mail');
    await until(async () => ((await notificationsFor(DEMO.plateauMember, `scan-${quietId}-`)).some((n) => n.emailedAt) ? true : undefined), 'the quiet notice to be settled');
    expect(await mails(DEMO.plateauMember, quiet)).toHaveLength(0);
    expect(await notificationsFor(DEMO.plateauMember, `scan-${quietId}-`)).toHaveLength(1);
    expect(await mails(DEMO.plateauViewer, 'digest')).toHaveLength(0);

    const first = await admin.post('/api/admin/notifications/digest').send({});
    expect(first.status).toBe(200);
    expect(first.body.users).toBeGreaterThanOrEqual(1);
    const digests = await mails(DEMO.plateauViewer, 'since the last digest');
    expect(digests).toHaveLength(1);
    const body = (await admin.get(`/api/admin/outbox/${digests[0].id}`)).body as { text: string; html: string };
    expect(body.text).toContain(`digest item 1 ${stamp}`);
    expect(body.text).toContain(`digest item 2 ${stamp}`);
    expect(body.text).toMatch(/one digest a day/);

    const second = await admin.post('/api/admin/notifications/digest').send({});
    expect(second.body).toEqual({ users: 0, notifications: 0 });
    expect(await mails(DEMO.plateauViewer, 'since the last digest')).toHaveLength(1);
  });

  it('counts unread notifications and marks them read, only the caller\'s own', async () => {
    const viewer = await t.signIn(DEMO.plateauViewer);
    const before = (await viewer.get('/api/notifications/unread-count')).body.unread as number;
    expect(before).toBeGreaterThanOrEqual(3);
    const unread = await viewer.get('/api/notifications').query({ unread: 'true', pageSize: 500 });
    expect(unread.body.total).toBe(before);
    const newest = unread.body.items[0];
    const read = await viewer.post(`/api/notifications/${newest.id}/read`).send({});
    expect(read.status).toBe(200);
    expect(read.body.readAt).not.toBeNull();
    expect((await viewer.get('/api/notifications/unread-count')).body).toEqual({ unread: before - 1 });

    const member = await t.signIn(DEMO.plateauMember);
    expect((await member.post(`/api/notifications/${newest.id}/read`).send({})).status).toBe(404);
    expect((await viewer.post('/api/notifications/read-all').send({})).body).toEqual({ unread: 0 });
    expect((await viewer.get('/api/notifications').query({ unread: 'true' })).body.total).toBe(0);
  });
});
