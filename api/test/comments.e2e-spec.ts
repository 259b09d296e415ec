import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { AuditEvent } from '../src/audit/entities/audit-event.entity';
import { Comment } from '../src/comments/entities/comment.entity';
import { Group } from '../src/groups/entities/group.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { User } from '../src/users/entities/user.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { storedSpec } from './support/stored-spec';

describe('comments on scans and points', () => {
  let t: TestApp;
  let scanId: number;
  beforeAll(async () => {
    t = await createTestApp();
    const plateau = await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' });
    const owner = await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauMember });
    scanId = (await t.db.getRepository(Scan).save({
      groupId: plateau.id, ownerId: owner.id, name: 'comments draft', method: 'slowroll', status: 'draft', spec: storedSpec(plateau.id), note: '', totalPoints: 4,
    })).id;
  });
  afterAll(async () => {
    await t.db.getRepository(Scan).delete({ id: scanId });
    await t.close();
  });

  it('stores the body exactly as typed, markup included, and lists threads by point', async () => {
    const viewer = await t.signIn(DEMO.plateauViewer);
    const body = '<img src=x onerror=alert(1)> & "quotes"';
    const posted = await viewer.post(`/api/scans/${scanId}/comments`).send({ body, pointIndex: 2 });
    expect(posted.status).toBe(201);
    expect(posted.body).toMatchObject({ body, pointIndex: 2, edited: false, author: { handle: 'tomas.reyes', displayName: 'Tomás Reyes' }, mentions: [] });
    expect((await t.db.getRepository(Comment).findOneByOrFail({ id: posted.body.id })).body).toBe(body);

    const member = await t.signIn(DEMO.plateauMember);
    await member.post(`/api/scans/${scanId}/comments`).send({ body: 'on the whole scan' });
    const point = await member.get(`/api/scans/${scanId}/comments`).query({ pointIndex: 2 });
    expect(point.body.map((c: { body: string }) => c.body)).toEqual([body]);
    const whole = await member.get(`/api/scans/${scanId}/comments`);
    expect(whole.body.map((c: { body: string }) => c.body)).toEqual(['on the whole scan']);
    expect((await member.get(`/api/scans/${scanId}/comments/counts`)).body).toEqual({ scan: 1, points: { '2': 1 } });
  });

  it('refuses empty, too long and out-of-range comments, and hides the scan from outsiders', async () => {
    const member = await t.signIn(DEMO.plateauMember);
    expect((await member.post(`/api/scans/${scanId}/comments`).send({ body: '   ' })).status).toBe(400);
    expect((await member.post(`/api/scans/${scanId}/comments`).send({ body: 'x'.repeat(5001) })).status).toBe(400);
    expect((await member.post(`/api/scans/${scanId}/comments`).send({ body: 'x'.repeat(5000) })).status).toBe(201);
    const outOfRange = await member.post(`/api/scans/${scanId}/comments`).send({ body: 'far away', pointIndex: 4 });
    expect(outOfRange.status).toBe(400);
    expect(outOfRange.body.fieldErrors.pointIndex).toBeDefined();
    const outsider = await t.signIn(DEMO.tensorLead);
    expect((await outsider.get(`/api/scans/${scanId}/comments`)).status).toBe(404);
    expect((await outsider.post(`/api/scans/${scanId}/comments`).send({ body: 'hello' })).status).toBe(404);
  });

  it('lets authors edit and delete their own, leads delete any, and audits each deletion', async () => {
    const member = await t.signIn(DEMO.plateauMember);
    const viewer = await t.signIn(DEMO.plateauViewer);
    const lead = await t.signIn(DEMO.plateauLead);
    const outsider = await t.signIn(DEMO.tensorLead);
    const mine = (await member.post(`/api/scans/${scanId}/comments`).send({ body: 'first thought' })).body;
    expect((await viewer.patch(`/api/comments/${mine.id}`).send({ body: 'not yours' })).status).toBe(403);
    expect((await outsider.patch(`/api/comments/${mine.id}`).send({ body: 'not yours' })).status).toBe(404);
    const edited = await member.patch(`/api/comments/${mine.id}`).send({ body: 'second thought' });
    expect(edited.status).toBe(200);
    expect(edited.body).toMatchObject({ body: 'second thought', edited: true });

    expect((await viewer.delete(`/api/comments/${mine.id}`).set('content-type', 'application/json').send('{}')).status).toBe(403);
    expect((await outsider.delete(`/api/comments/${mine.id}`).set('content-type', 'application/json').send('{}')).status).toBe(404);
    expect((await member.delete(`/api/comments/${mine.id}`).set('content-type', 'application/json').send('{}')).status).toBe(204);
    const other = (await viewer.post(`/api/scans/${scanId}/comments`).send({ body: 'from the viewer' })).body;
    expect((await lead.delete(`/api/comments/${other.id}`).set('content-type', 'application/json').send('{}')).status).toBe(204);
    expect(await t.db.getRepository(Comment).findOneBy({ id: mine.id })).toBeNull();

    const events = await t.db.getRepository(AuditEvent).find({ where: { action: 'comment.delete' }, order: { id: 'ASC' } });
    const byTarget = new Map(events.map((e) => [e.targetId, e]));
    expect(byTarget.get(String(mine.id))?.actorId).toBe(mine.author.id);
    expect(byTarget.get(String(other.id))?.details).toMatchObject({ scanId, authorId: other.author.id });
  });
});
