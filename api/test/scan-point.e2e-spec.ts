import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { spawn } from 'node:child_process';
import path from 'node:path';
import { pointRequest, RequestEvaluator, ScanGrid, type StoredScanSpec } from '@sixtyfold/shared';
import { Group } from '../src/groups/entities/group.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { ScanPoint } from '../src/scans/entities/scan-point.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { until } from './support/until';

// GET /api/scans/:id/points/:pointIndex: one point by its grid index, as the point page reads it.
const WORKER_MAIN = path.resolve('../worker/dist/main.js');

describe('one scan point by index', () => {
  let t: TestApp;
  let plateauId: number;
  beforeAll(async () => {
    t = await createTestApp();
    plateauId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
  });
  afterAll(() => t.close());

  it('answers 404 until a point is stored, then the stored point with its inputs, status and outputs', async () => {
    const member = await t.signIn(DEMO.plateauMember);
    // φ² from φ_init = 16 has about 63.5 e-folds: the N_* = 90 points fail, the others do not.
    const created = await member.post('/api/scans').send({
      groupId: plateauId, name: 'points one by one', model: { kind: 'family', family: 'monomial' }, phiInit: 16,
      axes: [
        { kind: 'list', parameter: 'p', values: [1, 2] },
        { kind: 'list', parameter: 'nStar', values: [50, 60, 90] },
      ],
      pivot: { kind: 'fixed' }, method: 'slowroll',
    });
    expect(created.status).toBe(201);
    const id = created.body.id as number;

    // No worker has run yet: the point is inside the grid but not computed.
    const early = await member.get(`/api/scans/${id}/points/4`);
    expect(early.status).toBe(404);
    expect(early.body.message).toBe('point 4 is not stored yet');

    const worker = spawn(process.execPath, [WORKER_MAIN], { env: process.env, stdio: 'ignore' });
    try {
      await until(async () => {
        const res = await member.get(`/api/scans/${id}`);
        return res.body.status === 'completed' ? res.body : undefined;
      }, 'the scan to complete');
    } finally {
      await new Promise<void>((resolve) => { worker.once('exit', () => resolve()); worker.kill('SIGTERM'); });
    }

    // Point 4 is p index 1, N_* index 1 (last axis fastest): p = 2, N_* = 60.
    const res = await member.get(`/api/scans/${id}/points/4`);
    expect(res.status).toBe(200);
    const row = await t.db.getRepository(ScanPoint).findOneByOrFail({ scanId: id, pointIndex: 4 });
    const stored = (await t.db.getRepository(Scan).findOneByOrFail({ id })).spec as unknown as StoredScanSpec;
    const direct = new RequestEvaluator().evaluate(pointRequest(stored, stored.potentialSource, new ScanGrid(stored.axes!).point(4)));
    expect(res.body).toMatchObject({ pointIndex: 4, inputs: { p: 2, nStar: 60 }, status: 'ok', failureReason: null });
    expect(res.body.ns).toBe(row.ns);
    expect(res.body.ns).toBe(direct.ns);
    expect(res.body.r).toBe(direct.r);
    expect(res.body.nStar).toBe(60);
    expect(res.body.amplitudeScale).toBe(direct.amplitudeScale);

    const failed = await member.get(`/api/scans/${id}/points/5`);
    expect(failed.status).toBe(200);
    expect(failed.body).toMatchObject({ pointIndex: 5, inputs: { p: 2, nStar: 90 }, status: 'insufficient_efolds', ns: null, r: null });
    expect(failed.body.failureReason).toMatch(/fewer than N_\* = 90/);

    const outside = await member.get(`/api/scans/${id}/points/6`);
    expect(outside.status).toBe(404);
    expect(outside.body.message).toBe('point 6 is outside the grid of 6 points (index 0 to 5)');
    expect((await member.get(`/api/scans/${id}/points/-1`)).status).toBe(404);
    expect((await member.get(`/api/scans/${id}/points/two`)).status).toBe(400);

    // Viewers read points; people outside the group do not learn the scan exists.
    const viewer = await t.signIn(DEMO.plateauViewer);
    expect((await viewer.get(`/api/scans/${id}/points/0`)).body).toMatchObject({ pointIndex: 0, inputs: { p: 1, nStar: 50 }, status: 'ok' });
    const outsider = await t.signIn(DEMO.tensorMember);
    const hidden = await outsider.get(`/api/scans/${id}/points/0`);
    expect(hidden.status).toBe(404);
    expect(hidden.body.message).toBe('No such scan');
    expect((await t.http().get(`/api/scans/${id}/points/0`)).status).toBe(401);
  });
});
