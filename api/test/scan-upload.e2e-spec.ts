import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import type { ChildProcess } from 'node:child_process';
import { Like } from 'typeorm';
import { pointRequest, POINTS_CSV_MAX_BYTES, RequestEvaluator, ScanPointList, type StoredScanSpec } from '@sixtyfold/shared';
import { Group } from '../src/groups/entities/group.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { ScanPoint } from '../src/scans/entities/scan-point.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { until } from './support/until';
import { startWorkers, stopWorkers } from './support/workers';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
// Every scan this file makes is named so, and removed at the end.
const PREFIX = 'e2e points upload';
// Multipart bodies are not JSON, so the CSRF check wants the app's own request header.
const UPLOAD_HEADER = ['X-Sixtyfold-Request', 'upload'] as const;

const pointsCsv = '# natural inflation, hand-picked points\nf,nStar\n5,50\n7.5,55\n\n10,60\n6,58\n';

describe('scans from an uploaded points file', () => {
  let t: TestApp;
  let plateauId: number;
  let member: Agent;
  let workers: ChildProcess[] = [];

  const settings = (name: string) => ({
    groupId: plateauId,
    name: `${PREFIX}: ${name}`,
    model: { kind: 'family', family: 'natural' },
    params: { Lambda: 5e-3 },
    pivot: { kind: 'fixed' },
    method: 'slowroll',
  });
  const scanCount = () => t.db.getRepository(Scan).countBy({ name: Like(`${PREFIX}%`) });

  function upload(agent: Agent, spec: unknown, text: string, filename = 'points.csv', contentType = 'text/csv') {
    return agent
      .post('/api/scans/upload')
      .set(...UPLOAD_HEADER)
      .field('spec', typeof spec === 'string' ? spec : JSON.stringify(spec))
      .attach('points', Buffer.from(text), { filename, contentType });
  }

  beforeAll(async () => {
    t = await createTestApp();
    plateauId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    member = await t.signIn(DEMO.plateauMember);
    workers = startWorkers(2);
  });
  afterAll(async () => {
    await stopWorkers(workers);
    await t.db.getRepository(Scan).delete({ name: Like(`${PREFIX}%`) });
    await t.close();
  });

  it('runs the points of the file through the workers; the stored points equal the engine run directly', async () => {
    const created = await upload(member, settings('four points'), pointsCsv);
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ status: 'queued', totalPoints: 4 });
    const id = created.body.id as number;
    const stored = (await t.db.getRepository(Scan).findOneByOrFail({ id })).spec as unknown as StoredScanSpec;
    expect(stored.axes).toBeUndefined();
    expect(stored.pointList).toEqual({ columns: ['f', 'nStar'], rows: [[5, 50], [7.5, 55], [10, 60], [6, 58]] });

    const done = await until(async () => {
      const res = await member.get(`/api/scans/${id}`);
      return res.body.status === 'completed' ? res.body : undefined;
    }, 'the uploaded scan to complete');
    expect(done).toMatchObject({ totalPoints: 4, donePoints: 4, failedPoints: 0 });

    const rows = await t.db.getRepository(ScanPoint).find({ where: { scanId: id }, order: { pointIndex: 'ASC' } });
    expect(rows.map((r) => r.inputs)).toEqual([{ f: 5, nStar: 50 }, { f: 7.5, nStar: 55 }, { f: 10, nStar: 60 }, { f: 6, nStar: 58 }]);
    const engine = new RequestEvaluator();
    const list = new ScanPointList(stored.pointList!);
    for (const index of [1, 3]) {
      const direct = engine.evaluate(pointRequest(stored, 'natural', list.point(index)));
      expect(rows[index].status).toBe('ok');
      expect(rows[index].ns).toBe(direct.ns);
      expect(rows[index].r).toBe(direct.r);
      expect(rows[index].nStar).toBe(direct.nStar);
    }

    // The points table, its export and the plane know the columns; a heatmap slice does not exist.
    const sorted = await member.get(`/api/scans/${id}/points?sort=input.f&order=desc`);
    expect(sorted.body.items.map((p: { pointIndex: number }) => p.pointIndex)).toEqual([2, 1, 3, 0]);
    const csv = await member.get(`/api/scans/${id}/points?format=csv`);
    const lines = csv.text.trim().split('\n').filter((l) => !l.startsWith('#'));
    expect(lines[0]).toMatch(/^pointIndex,f,nStar,status,failureReason,ns,r,/);
    expect(lines[2].split(',').slice(0, 3).map(Number)).toEqual([1, 7.5, 55]);
    const plane = await member.get(`/api/scans/${id}/plane`);
    expect(plane.status).toBe(200);
    expect(plane.body).toMatchObject({ okPoints: 4, parameters: ['f', 'nStar'], inputs: { f: [5, 7.5, 10, 6], nStar: [50, 55, 60, 58] } });
    expect(plane.body.ns).toEqual(rows.map((r) => r.ns));
    const heat = await member.get(`/api/scans/${id}/grid?x=f&y=nStar`);
    expect(heat.status).toBe(409);
    expect(heat.body.message).toMatch(/list of points, not a grid/);
  });

  it('refuses a malformed row with its line, and stores nothing', async () => {
    const before = await scanCount();
    const res = await upload(member, settings('bad row'), 'f,nStar\n5,50\n\n7,fifty\n');
    expect(res.status).toBe(400);
    expect(res.body).toMatchObject({ message: "line 4: column nStar is not a finite number ('fifty')", line: 4 });
    const short = await upload(member, settings('short row'), 'f,nStar\n5,50\n7\n');
    expect(short.body).toMatchObject({ message: 'line 3: expected 2 values (f, nStar), found 1', line: 3 });
    expect(await scanCount()).toBe(before);
  });

  it('refuses columns the model or the pivot does not allow, on the header line', async () => {
    const before = await scanCount();
    const unknown = await upload(member, settings('unknown column'), '# notes first\nf,lambda,nStar\n5,1,50\n');
    expect(unknown.status).toBe(400);
    expect(unknown.body).toMatchObject({ message: 'line 2: the model has no parameter lambda; it has Lambda, f', line: 2 });
    const twice = await upload(member, settings('fixed and a column'), 'Lambda,f,nStar\n0.005,5,50\n');
    expect(twice.body).toMatchObject({ message: 'line 1: Lambda is both fixed and a column', line: 1 });
    const noNStar = await upload(member, settings('no N_*'), 'f\n5\n');
    expect(noNStar.status).toBe(400);
    expect(noNStar.body.fieldErrors).toEqual({ 'pivot.nStar': ['give N_* or add a column nStar'] });
    const withAxes = await upload(member, { ...settings('axes too'), axes: [{ kind: 'list', parameter: 'f', values: [5] }] }, pointsCsv);
    expect(withAxes.status).toBe(400);
    expect(withAxes.body.fieldErrors.spec[0]).toMatch(/without axes or pointList/);
    expect((await upload(member, '{"groupId":', pointsCsv)).body.fieldErrors).toEqual({ spec: ['the scan settings are not valid JSON'] });
    expect(await scanCount()).toBe(before);
  });

  it('refuses a file over the limit (413) and a file of another type (415), storing nothing', async () => {
    const before = await scanCount();
    const row = '1.000000000000,55.000000000000\n';
    const huge = `f,nStar\n${row.repeat(Math.ceil(POINTS_CSV_MAX_BYTES / row.length) + 1)}`;
    const tooLarge = await upload(member, settings('too large'), huge);
    expect(tooLarge.status).toBe(413);
    expect(tooLarge.body.message).toBe('The file is larger than the limit of 8 MB');
    const wrongType = await upload(member, settings('wrong type'), pointsCsv, 'points.xlsx', 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
    expect(wrongType.status).toBe(415);
    expect(await scanCount()).toBe(before);
  });

  it('lets a viewer submit nothing, whatever the file', async () => {
    const viewer = await t.signIn(DEMO.plateauViewer);
    const res = await upload(viewer, settings('by a viewer'), 'f,nStar\n5,fifty\n');
    expect(res.status).toBe(403);
    expect(await t.db.getRepository(Scan).countBy({ name: `${PREFIX}: by a viewer` })).toBe(0);
  });
});
