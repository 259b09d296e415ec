import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import type { ChildProcess } from 'node:child_process';
import type request from 'supertest';
import { POINT_OUTPUTS } from '@sixtyfold/shared';
import { Group } from '../src/groups/entities/group.entity';
import { ScanChunkRun } from '../src/scans/entities/scan-chunk-run.entity';
import { ScanPoint } from '../src/scans/entities/scan-point.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { until } from './support/until';
import { startWorkers, stopWorkers } from './support/workers';

// Reproducibility: one spec computed as two scans, each by its own worker process, to the same
// bits; and "Check reproducibility", which recomputes a random sample on today's engine through
// the queue and compares every output with what the scan stored.

type Agent = ReturnType<typeof request.agent>;

describe('reproducibility', () => {
  let t: TestApp;
  let groupId: number;
  let workers: ChildProcess[] = [];
  let first: { id: number; pid: string };
  let second: { id: number; pid: string };

  beforeAll(async () => {
    t = await createTestApp();
    groupId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
  });
  afterAll(async () => {
    await stopWorkers(workers);
    await t.close();
  });

  // The exact method: mode equations as well as the background, so both integrators are checked.
  const spec = (name: string) => ({
    groupId, name, tags: [], model: { kind: 'family', family: 'natural' }, params: {}, method: 'exact', pivot: { kind: 'fixed' },
    axes: [
      { kind: 'list', parameter: 'f', values: [5, 7, 10] },
      { kind: 'range', parameter: 'nStar', min: 50, max: 60, count: 4, spacing: 'linear' },
    ],
  });

  async function computed(agent: Agent, name: string): Promise<number> {
    const created = await agent.post('/api/scans').send(spec(name));
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    await until(async () => ((await agent.get(`/api/scans/${id}`)).body.status === 'completed' ? true : undefined), 'the scan to complete');
    return id;
  }

  async function checked(agent: Agent, scanId: number, body: object) {
    const created = await agent.post(`/api/scans/${scanId}/reproductions`).send(body);
    expect(created.status).toBe(201);
    expect(['queued', 'running', 'completed']).toContain(created.body.status); // a free worker may take it at once
    return until(async () => {
      const res = await agent.get(`/api/scans/${scanId}/reproductions/${created.body.id}`);
      return res.body.status === 'completed' || res.body.status === 'failed' ? res.body : undefined;
    }, 'the check to finish');
  }

  const workersOf = async (scanId: number) => [...new Set((await t.db.getRepository(ScanChunkRun).findBy({ scanId })).map((r) => r.worker.split(':').pop()))];
  const pointsOf = (scanId: number) => t.db.getRepository(ScanPoint).find({ where: { scanId }, order: { pointIndex: 'ASC' } });

  it('reads a stored double back to the same bits (mysql2 alone is an ulp off past 2^53 digits)', async () => {
    const [row] = await t.db.query('SELECT CAST(? AS DOUBLE) AS d, CAST(? AS DOUBLE) AS e', ['9.081184755800415', '17.924970781555523']);
    expect(row.d).toBe(9.081184755800415);
    expect(row.e).toBe(17.924970781555523);
  });

  it('computes one spec as two scans on two worker processes to the same bits', async () => {
    const agent = await t.signIn(DEMO.plateauMember);
    const [a] = startWorkers(1);
    first = { id: await computed(agent, 'reproducible, first'), pid: String(a.pid) };
    await stopWorkers([a]);
    workers = startWorkers(1);
    second = { id: await computed(agent, 'reproducible, second'), pid: String(workers[0].pid) };
    expect(await workersOf(first.id)).toEqual([first.pid]);
    expect(await workersOf(second.id)).toEqual([second.pid]);

    const [one, two] = [await pointsOf(first.id), await pointsOf(second.id)];
    expect(one).toHaveLength(12);
    expect(one.filter((p) => p.status === 'ok').length).toBeGreaterThan(6);
    for (const [i, p] of one.entries()) {
      const q = two[i];
      expect([q.pointIndex, q.status]).toEqual([p.pointIndex, p.status]);
      for (const output of POINT_OUTPUTS) expect(Object.is(p[output], q[output])).toBe(true);
    }
  });

  it("reports every output identical when a stored scan's OK points are recomputed on another worker", async () => {
    const agent = await t.signIn(DEMO.plateauMember);
    const ok = (await pointsOf(first.id)).filter((p) => p.status === 'ok').map((p) => p.pointIndex);
    const check = await checked(agent, first.id, { sampleSize: 1000 });
    expect(check.status).toBe('completed');
    expect(check.pointIndices).toEqual(ok);
    expect(check.sampleSize).toBe(ok.length);
    expect(check.checkedBuild.worker.split(':').pop()).toBe(second.pid);

    expect(check.report.identical).toBe(true);
    expect(check.report.statusChanges).toEqual([]);
    for (const output of check.report.outputs) expect(output).toMatchObject({ compared: ok.length, identical: true, differing: 0, maxRelativeDifference: null });
    expect(check.report.outputs.map((o: { output: string }) => o.output)).toEqual([...POINT_OUTPUTS]);

    // The build the scan was computed with, beside today's: the same here, and both recorded.
    const list = await agent.get(`/api/scans/${first.id}/reproductions`);
    expect(list.status).toBe(200);
    expect(list.body.scanBuild).toEqual(list.body.today);
    expect(check.scanBuild).toEqual(list.body.today);
    expect(list.body.items[0].id).toBe(check.id);

    // The default sample is 20 points, chosen among the OK ones (this scan has fewer: all of them).
    const byDefault = await agent.post(`/api/scans/${first.id}/reproductions`).send({});
    expect(byDefault.body.pointIndices).toEqual(ok);
  });

  it('reports a deliberately altered stored value as different, with its point and relative difference', async () => {
    const agent = await t.signIn(DEMO.plateauMember);
    const target = (await pointsOf(first.id)).filter((p) => p.status === 'ok')[2];
    const original = target.ns!;
    await t.db.query('UPDATE scan_points SET ns = ? WHERE scan_id = ? AND point_index = ?', [original * (1 + 1e-9), first.id, target.pointIndex]);
    const altered = (await t.db.getRepository(ScanPoint).findOneByOrFail({ scanId: first.id, pointIndex: target.pointIndex })).ns!;
    expect(altered).not.toBe(original);

    const check = await checked(agent, first.id, { sampleSize: 1000 });
    expect(check.report.identical).toBe(false);
    const ns = check.report.outputs.find((o: { output: string }) => o.output === 'ns');
    expect(ns).toMatchObject({ identical: false, differing: 1, atPointIndex: target.pointIndex });
    expect(ns.maxRelativeDifference).toBe(Math.abs(altered - original) / Math.max(Math.abs(altered), Math.abs(original)));
    expect(ns.maxRelativeDifference).toBeCloseTo(1e-9, 12);
    expect(check.report.outputs.filter((o: { identical: boolean }) => !o.identical).map((o: { output: string }) => o.output)).toEqual(['ns']);
    // What the worker recomputed is stored with the check: the original value.
    const [{ recomputed }] = await t.db.query('SELECT recomputed FROM scan_reproductions WHERE id = ?', [check.id]);
    const again = (typeof recomputed === 'string' ? JSON.parse(recomputed) : recomputed) as { pointIndex: number; ns: number }[];
    expect(again.find((p) => p.pointIndex === target.pointIndex)!.ns).toBe(original);
  });

  it('refuses a sample size out of range, naming the field, and a viewer', async () => {
    const agent = await t.signIn(DEMO.plateauMember);
    for (const sampleSize of [0, 1001, 2.5, 'many']) {
      const res = await agent.post(`/api/scans/${first.id}/reproductions`).send({ sampleSize });
      expect(res.status).toBe(400);
      expect(JSON.stringify(res.body)).toMatch(/sampleSize/);
    }
    const viewer = await t.signIn(DEMO.plateauViewer);
    expect((await viewer.post(`/api/scans/${first.id}/reproductions`).send({})).status).toBe(403);
    expect((await viewer.get(`/api/scans/${first.id}/reproductions`)).status).toBe(200);
  });
});
