import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { In, Like } from 'typeorm';
import { Comment } from '../src/comments/entities/comment.entity';
import { Group } from '../src/groups/entities/group.entity';
import { Invitation } from '../src/invitations/entities/invitation.entity';
import { Notification } from '../src/notifications/entities/notification.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { User } from '../src/users/entities/user.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { createUser, runTag } from './support/users';
import { storedSpec } from './support/stored-spec';

// The counts are per user, so the authors and leads here are new accounts: nothing another
// suite did with the demo users counts against them.
const MENTION_LIMIT = 3;
const INVITATION_LIMIT = 2;
const tag = runTag();

describe('hourly limits on the e-mails one user causes', () => {
  let t: TestApp;
  let plateauId: number;
  let scanId: number;
  const made: number[] = [];

  beforeAll(async () => {
    t = await createTestApp({ MAIL_MENTION_LIMIT_PER_HOUR: String(MENTION_LIMIT), MAIL_INVITATION_LIMIT_PER_HOUR: String(INVITATION_LIMIT) });
    plateauId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    const owner = await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauMember });
    scanId = (await t.db.getRepository(Scan).save({
      groupId: plateauId, ownerId: owner.id, name: `mail limits ${tag}`, method: 'slowroll', status: 'draft', spec: storedSpec(plateauId), note: '', totalPoints: 4,
    })).id;
  });
  afterAll(async () => {
    await t.db.getRepository(Scan).delete({ id: scanId });
    await t.db.getRepository(Invitation).delete({ email: Like(`%-${tag}@elsewhere.example`) });
    if (made.length) await t.db.getRepository(User).delete({ id: In(made) });
    await t.close();
  });

  const newUser = async (handle: string, role: 'lead' | 'viewer') => {
    const user = await createUser(t.db, `${handle}-${tag}`, { groupSlug: 'plateau-models', role });
    made.push(user.id);
    return user;
  };
  const mentionsOf = async (email: string) => {
    const user = await t.db.getRepository(User).findOneByOrFail({ email });
    return t.db.getRepository(Notification).countBy({ userId: user.id, kind: 'mentioned' });
  };

  it('past the mention limit a comment is refused with 429 and nothing saved; comments without mentions go on', async () => {
    const author = await t.signIn((await newUser('mentioner', 'viewer')).email);
    const post = (body: string) => author.post(`/api/scans/${scanId}/comments`).send({ body });
    const comments = () => t.db.getRepository(Comment).countBy({ scanId });

    expect((await post('@henrik.solberg @lucia.marin please look at the tail')).status).toBe(201); // 2 of 3
    const tomasBefore = await mentionsOf(DEMO.plateauViewer);
    const before = await comments();

    const refused = await post('@tomas.reyes @lucia.marin and this one');
    expect(refused.status).toBe(429);
    expect(refused.body.message).toMatch(
      /^This would e-mail 2 mentioned people, but your @-mentions may e-mail at most 3 people an hour \(2 so far\), so the comment was not saved\. Try again in \d+ min/,
    );
    const retryAfter = Number(refused.headers['retry-after']);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(3600);
    expect(await comments()).toBe(before);
    expect(await mentionsOf(DEMO.plateauViewer)).toBe(tomasBefore);

    expect((await post('@tomas.reyes just you then')).status).toBe(201); // 3 of 3
    expect(await mentionsOf(DEMO.plateauViewer)).toBe(tomasBefore + 1);
    const plain = await post('a remark that mentions nobody');
    expect(plain.status).toBe(201);

    // An edit that adds a mention counts as well, and leaves the comment as it was.
    const edit = await author.patch(`/api/comments/${plain.body.id}`).send({ body: 'a remark for @henrik.solberg' });
    expect(edit.status).toBe(429);
    expect((await t.db.getRepository(Comment).findOneByOrFail({ id: plain.body.id })).body).toBe('a remark that mentions nobody');

    // The limit is the author's: another author may still mention people.
    const other = await t.signIn((await newUser('other-mentioner', 'viewer')).email);
    expect((await other.post(`/api/scans/${scanId}/comments`).send({ body: '@henrik.solberg agreed' })).status).toBe(201);
  });

  it('a comment mentioning more people than the hourly limit says to mention fewer', async () => {
    for (const handle of ['a', 'b', 'c', 'd']) await newUser(`crowd-${handle}`, 'viewer');
    const author = await t.signIn((await newUser('crowd-caller', 'viewer')).email);
    const body = ['a', 'b', 'c', 'd'].map((h) => `@crowd-${h}-${tag}`).join(' ');
    const refused = await author.post(`/api/scans/${scanId}/comments`).send({ body });
    expect(refused.status).toBe(429);
    expect(refused.body.message).toMatch(/would e-mail 4 mentioned people, more than the 3 an hour .* Mention fewer people\.$/);
  });

  it('past the invitation limit a lead is refused with 429; nothing is saved or sent', async () => {
    const lead = await t.signIn((await newUser('inviter', 'lead')).email);
    const invite = (n: number) => lead.post(`/api/groups/${plateauId}/invitations`).send({ email: `guest${n}-${tag}@elsewhere.example`, role: 'viewer' });
    for (let n = 1; n <= INVITATION_LIMIT; n++) expect((await invite(n)).status).toBe(201);
    const refused = await invite(INVITATION_LIMIT + 1);
    expect(refused.status).toBe(429);
    expect(refused.body.message).toMatch(/^You may send at most 2 invitations an hour \(2 so far\), so this invitation was not saved or sent\. Try again in \d+ min\.$/);
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    expect(await t.db.getRepository(Invitation).countBy({ email: `guest${INVITATION_LIMIT + 1}-${tag}@elsewhere.example` })).toBe(0);

    // Another lead of the same group is not held back.
    const otherLead = await t.signIn((await newUser('other-inviter', 'lead')).email);
    const res = await otherLead.post(`/api/groups/${plateauId}/invitations`).send({ email: `guest${INVITATION_LIMIT + 1}-${tag}@elsewhere.example`, role: 'viewer' });
    expect(res.status).toBe(201);
  });
});
