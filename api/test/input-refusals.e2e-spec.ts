import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { Group } from '../src/groups/entities/group.entity';
import { PotentialModel } from '../src/models/entities/potential-model.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';

/**
 * Inputs the fuzz suite (fuzz.e2e-spec.ts) once answered with a 500 or with a 400 that named no
 * field, each as a fixed case: every answer here is a 4xx that says what was wrong, and where.
 */

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
const UPLOAD_HEADER = ['X-Sixtyfold-Request', 'upload'] as const;

describe('refusals of malformed input name the field, the line or the body', () => {
  let t: TestApp;
  let admin: Agent;
  let member: Agent;
  let plateauId: number;
  let tensorModelId: number;

  const scan = (overrides: Record<string, unknown>) => ({
    groupId: plateauId,
    name: 'refusal check',
    model: { kind: 'family', family: 'natural' },
    params: { Lambda: 5e-3 },
    axes: [{ kind: 'list', parameter: 'f', values: [5, 7] }],
    pivot: { kind: 'fixed', nStar: 55 },
    method: 'slowroll',
    ...overrides,
  });

  beforeAll(async () => {
    t = await createTestApp();
    admin = await t.signIn(DEMO.admin);
    member = await t.signIn(DEMO.plateauMember);
    plateauId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    const tensor = await t.db.getRepository(Group).findOneByOrFail({ slug: 'tensor-modes' });
    tensorModelId = (await t.db.getRepository(PotentialModel).findOneByOrFail({ groupId: tensor.id })).id;
  });
  afterAll(async () => {
    // Every refused case here must have stored nothing; the one scan made to read is removed.
    expect(await t.db.getRepository(Scan).countBy({ name: 'refusal check' })).toBe(0);
    await t.db.getRepository(Scan).delete({ name: 'refusal check: points' });
    await t.close();
  });

  it('a scan in a group that does not exist is a 404 on groupId, also for a site admin (who passes every role check)', async () => {
    const missing = (await t.db.getRepository(Group).maximum('id'))! + 1000;
    for (const agent of [admin, member]) {
      const res = await agent.post('/api/scans').send(scan({ groupId: missing }));
      expect(res.status).toBe(404);
    }
    const res = await admin.post('/api/scans').send(scan({ groupId: missing }));
    expect(res.body).toMatchObject({ message: 'groupId: no such group', fieldErrors: { groupId: ['no such group'] } });
  });

  it("a scan over another group's model is a 404 on model.modelId", async () => {
    const res = await member.post('/api/scans').send(scan({ model: { kind: 'group', modelId: tensorModelId }, params: {}, phiInit: 5 }));
    expect(res.status).toBe(404);
    expect(res.body.fieldErrors).toEqual({ 'model.modelId': ['no such model in this group'] });
  });

  it('a body that is not JSON says so, with where the parser stopped', async () => {
    const broken = await member.post('/api/scans').set('Content-Type', 'application/json').send('{"groupId":1,"note":00}');
    expect(broken.status).toBe(400);
    expect(broken.body.message).toMatch(/^The request body is not valid JSON: .*position 21/);
    // The parser takes only objects and arrays.
    const scalar = await member.post('/api/models').set('Content-Type', 'application/json').send('null');
    expect(scalar.status).toBe(400);
    expect(scalar.body.message).toMatch(/^The request body is not valid JSON: /);
  });

  it('a multipart field over its limit is a 400 that leads with the field', async () => {
    const res = await member
      .post('/api/scans/upload')
      .set(...UPLOAD_HEADER)
      .field('spec', JSON.stringify(scan({ axes: undefined, note: 'x'.repeat(70 * 1024) })))
      .attach('points', Buffer.from('f\n5\n'), { filename: 'points.csv', contentType: 'text/csv' });
    expect(res.status).toBe(400);
    expect(res.body).toMatchObject({ message: 'spec: the value is longer than 64 kB', fieldErrors: { spec: ['the value is longer than 64 kB'] } });
  });

  it('a quote inside an unquoted cell of a points file is refused on its line', async () => {
    const res = await member
      .post('/api/scans/upload')
      .set(...UPLOAD_HEADER)
      .field('spec', JSON.stringify(scan({ axes: undefined, pivot: { kind: 'fixed' } })))
      .attach('points', Buffer.from('f,nStar\n5,50\n7,5"5\n'), { filename: 'points.csv', contentType: 'text/csv' });
    expect(res.status).toBe(400);
    expect(res.body.line).toBe(3);
    expect(res.body.message).toMatch(/^line 3: the file is not valid CSV: a quote is found/);
  });

  it('sorting or filtering points by an input the scan does not vary names the query key', async () => {
    const created = await member.post('/api/scans').send(scan({ name: 'refusal check: points' }));
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    expect((await member.post(`/api/scans/${id}/cancel`).send({})).status).toBe(200);
    const sorted = await member.get(`/api/scans/${id}/points?sort=input.zz`);
    expect(sorted.status).toBe(400);
    expect(Object.keys(sorted.body.fieldErrors)).toEqual(['sort']);
    expect(sorted.body.message).toMatch(/^sort: the scan has no axis zz; its axes are /);
    const filtered = await member.get(`/api/scans/${id}/points?input.zz_min=1&input.zz_max=2`);
    expect(filtered.status).toBe(400);
    expect(Object.keys(filtered.body.fieldErrors).sort()).toEqual(['input.zz_max', 'input.zz_min']);
  });
});
