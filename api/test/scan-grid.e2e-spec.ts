import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { roundForSlice, ScanGrid, scanGridSliceSchema, type ScanGridSlice } from '@sixtyfold/shared';
import { Group } from '../src/groups/entities/group.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { ScanPoint } from '../src/scans/entities/scan-point.entity';
import { User } from '../src/users/entities/user.entity';
import { storedSpec } from './support/stored-spec';
import { createTestApp, DEMO, type TestApp } from './support/test-app';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

// Three axes, so that a slice over f and N_* skips the Λ digit between its rows.
const AXES = [
  { kind: 'list' as const, parameter: 'f', values: [5, 6, 7, 8] },
  { kind: 'list' as const, parameter: 'Lambda', values: [1e-3, 2e-3, 3e-3] },
  { kind: 'list' as const, parameter: 'nStar', values: [50, 52, 54, 56, 58] },
];
const grid = new ScanGrid(AXES);
/** One point of the slice at Λ index 1 is not stored yet. */
const NOT_STORED = grid.indexOf([3, 1, 4]);

/** Each point's status and n_s, by point index: a known mix of OK points and two failure codes. */
function statusOf(index: number): string {
  if (index % 7 === 3) return 'no_end';
  if (index % 11 === 5) return 'insufficient_efolds';
  return 'ok';
}
const nsOf = (index: number) => 0.9 + index / 1000;

interface Block {
  values: number[];
  ok: number;
  failed: Record<string, number>;
}

/** The points of each cell of a slice over x = N_* and y = f at Λ index 1, gathered one by one. */
function expectedBlocks(x: { from: number; to: number; block: number }, y: { from: number; to: number; block: number }): Block[][] {
  const blocks: Block[][] = [];
  for (let iy = y.from; iy <= y.to; iy++) {
    for (let ix = x.from; ix <= x.to; ix++) {
      const index = grid.indexOf([iy, 1, ix]);
      const row = (blocks[Math.floor((iy - y.from) / y.block)] ??= []);
      const block = (row[Math.floor((ix - x.from) / x.block)] ??= { values: [], ok: 0, failed: {} });
      if (index === NOT_STORED) continue;
      const status = statusOf(index);
      if (status === 'ok') {
        block.ok++;
        block.values.push(nsOf(index));
      } else block.failed[status] = (block.failed[status] ?? 0) + 1;
    }
  }
  return blocks;
}

function expectCellsToMatch(slice: ScanGridSlice, blocks: Block[][], aggregated: boolean) {
  const nx = slice.x.values.length;
  expect(blocks.length).toBe(slice.y.values.length);
  expect(slice.ok).toHaveLength(nx * blocks.length);
  blocks.forEach((row, cy) => {
    expect(row).toHaveLength(nx);
    row.forEach((block, cx) => {
      const c = cy * nx + cx;
      expect(slice.ok[c]).toBe(block.ok);
      for (const reason of ['no_end', 'insufficient_efolds']) expect(slice.failed[reason]?.[c] ?? 0).toBe(block.failed[reason] ?? 0);
      // Means, minima and maxima travel to 7 significant digits; counts exactly.
      const mean = block.values.length ? block.values.reduce((s, v) => s + v, 0) / block.values.length : null;
      if (mean === null) expect(slice.mean![c]).toBeNull();
      else expect(slice.mean![c]).toBe(roundForSlice(mean));
      if (aggregated) {
        expect(slice.min![c]).toBe(block.values.length ? roundForSlice(Math.min(...block.values)) : null);
        expect(slice.max![c]).toBe(block.values.length ? roundForSlice(Math.max(...block.values)) : null);
      }
    });
  });
}

describe('heatmap slices: blocks, zoom windows and failure counts', () => {
  let t: TestApp;
  let member: Agent;
  let scanId: number;

  beforeAll(async () => {
    t = await createTestApp();
    const groupId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    const owner = await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauMember });
    const scan = await t.db.getRepository(Scan).save({
      groupId, ownerId: owner.id, name: 'heatmap blocks', method: 'slowroll', status: 'running',
      spec: storedSpec(groupId, { axes: AXES }), note: '', totalPoints: grid.size,
    });
    scanId = scan.id;
    const indices = Array.from({ length: grid.size }, (_, index) => index).filter((index) => index !== NOT_STORED);
    const rows = indices.map((index) => {
      const ok = statusOf(index) === 'ok';
      return {
        scanId, pointIndex: index, inputs: grid.point(index), status: statusOf(index), failureReason: ok ? null : 'a failure for the test',
        ns: ok ? nsOf(index) : null, r: ok ? 0.01 : null, alphaS: null, As: null, amplitudeScale: null, nTotal: null,
        nStar: ok ? grid.point(index).nStar : null, phiStar: null, phiEnd: null, energyScaleGeV: null, computedAt: new Date(),
      };
    });
    await t.db.getRepository(ScanPoint).insert(rows);
    member = await t.signIn(DEMO.plateauMember);
  });
  afterAll(async () => {
    if (scanId) await t.db.getRepository(Scan).delete({ id: scanId });
    await t.close();
  });

  const slice = async (query: string) => {
    const res = await member.get(`/api/scans/${scanId}/grid?x=nStar&y=f&at.Lambda=1&${query}`);
    expect(res.status).toBe(200);
    return scanGridSliceSchema.parse(res.body);
  };

  it('answers a slice that fits at one point per cell, without repeating the mean as min and max', async () => {
    const s = await slice('output=ns');
    expect(s.x).toEqual({ parameter: 'nStar', length: 5, from: 0, to: 4, block: 1, values: [50, 52, 54, 56, 58] });
    expect(s.y).toEqual({ parameter: 'f', length: 4, from: 0, to: 3, block: 1, values: [5, 6, 7, 8] });
    expect(s.at).toEqual({ Lambda: { index: 1, value: 2e-3 } });
    expect(s.min).toBeUndefined();
    expect(s.max).toBeUndefined();
    // Cell (ix = 1, iy = 3) is the point f = 8, Λ index 1, N_* = 52.
    expect(statusOf(grid.indexOf([3, 1, 1]))).toBe('ok');
    expect(s.mean![3 * 5 + 1]).toBe(roundForSlice(nsOf(grid.indexOf([3, 1, 1]))));
    expectCellsToMatch(s, expectedBlocks({ from: 0, to: 4, block: 1 }, { from: 0, to: 3, block: 1 }), false);
  });

  it('aggregates a slice larger than maxCells in blocks: mean, min, max and counts of each block', async () => {
    const s = await slice('output=ns&maxCells=2');
    // 5 N_* values in blocks of 3 (the last block has 2), 4 f values in blocks of 2.
    expect(s.x).toEqual({ parameter: 'nStar', length: 5, from: 0, to: 4, block: 3, values: [50, 56] });
    expect(s.y).toEqual({ parameter: 'f', length: 4, from: 0, to: 3, block: 2, values: [5, 7] });
    expectCellsToMatch(s, expectedBlocks({ from: 0, to: 4, block: 3 }, { from: 0, to: 3, block: 2 }), true);
    // The block of f 7–8 × N_* 56–58 holds the point never stored: 3 of its 4 points are counted.
    const last = 1 * 2 + 1;
    expect(s.ok[last] + Object.values(s.failed).reduce((n, counts) => n + counts[last], 0)).toBe(3);
  });

  it('returns a zoom window at full resolution when it fits, and in blocks when it does not', async () => {
    const full = await slice('output=ns&xFrom=1&xTo=3&yFrom=2&yTo=3&maxCells=3');
    expect(full.x).toEqual({ parameter: 'nStar', length: 5, from: 1, to: 3, block: 1, values: [52, 54, 56] });
    expect(full.y).toEqual({ parameter: 'f', length: 4, from: 2, to: 3, block: 1, values: [7, 8] });
    expect(full.ok).toHaveLength(6);
    expectCellsToMatch(full, expectedBlocks({ from: 1, to: 3, block: 1 }, { from: 2, to: 3, block: 1 }), false);

    const blocked = await slice('output=ns&xFrom=1&xTo=4&yFrom=1&yTo=3&maxCells=2');
    expect(blocked.x).toMatchObject({ from: 1, to: 4, block: 2, values: [52, 56] });
    expect(blocked.y).toMatchObject({ from: 1, to: 3, block: 2, values: [6, 8] });
    expectCellsToMatch(blocked, expectedBlocks({ from: 1, to: 4, block: 2 }, { from: 1, to: 3, block: 2 }), true);
  });

  it('counts failed points per reason present, and gives only counts for the status output', async () => {
    const s = await slice('output=status&maxCells=1');
    expect(s.mean).toBeUndefined();
    expect(s.x.block * s.y.block).toBe(20);
    const points = Array.from({ length: 4 }, (_, f) => Array.from({ length: 5 }, (_, n) => grid.indexOf([f, 1, n]))).flat().filter((i) => i !== NOT_STORED);
    const count = (status: string) => points.filter((i) => statusOf(i) === status).length;
    expect(Object.keys(s.failed).sort()).toEqual(['insufficient_efolds', 'no_end']);
    expect(s.failed).toEqual({ no_end: [count('no_end')], insufficient_efolds: [count('insufficient_efolds')] });
    expect(s.ok).toEqual([count('ok')]);
    // Only the reasons present in the window get a column.
    const row = await member.get(`/api/scans/${scanId}/grid?x=nStar&y=f&at.Lambda=0&output=status&yFrom=0&yTo=0`);
    const reasons = [0, 1, 2, 3, 4].map((n) => statusOf(grid.indexOf([0, 0, n]))).filter((s) => s !== 'ok');
    expect(Object.keys(row.body.failed).sort()).toEqual([...new Set(reasons)].sort());
  });

  it('refuses windows outside the axes and cell limits past the display, naming the field', async () => {
    const beyond = await member.get(`/api/scans/${scanId}/grid?x=nStar&y=f&xTo=5`);
    expect(beyond.status).toBe(400);
    expect(beyond.body.fieldErrors.xTo[0]).toMatch(/nStar has 5 values \(index 0 to 4\)/);
    const reversed = await member.get(`/api/scans/${scanId}/grid?x=nStar&y=f&yFrom=3&yTo=1`);
    expect(reversed.status).toBe(400);
    expect(reversed.body.fieldErrors.yTo[0]).toMatch(/must not be below yFrom/);
    const fromOnly = await member.get(`/api/scans/${scanId}/grid?x=nStar&y=f&xFrom=4`);
    expect(fromOnly.status).toBe(200);
    expect(fromOnly.body.x).toMatchObject({ from: 4, to: 4, values: [58] });
    const tooMany = await member.get(`/api/scans/${scanId}/grid?x=nStar&y=f&maxCells=513`);
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.fieldErrors.maxCells[0]).toMatch(/at most 512/);
  });
});

describe('heatmap slices of finished scans: kept until a retry reopens the scan', () => {
  let t: TestApp;
  let owner: Agent;
  let scanId: number;
  const axes = [
    { kind: 'list' as const, parameter: 'f', values: [5, 6] },
    { kind: 'list' as const, parameter: 'nStar', values: [50, 55, 60] },
  ];
  const small = new ScanGrid(axes);
  /** Point 4 failed; every other point has n_s = 0.95 + index / 100. */
  const FAILED = 4;

  beforeAll(async () => {
    t = await createTestApp();
    const groupId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    const user = await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauMember });
    const scan = await t.db.getRepository(Scan).save({
      groupId, ownerId: user.id, name: 'kept heatmap', method: 'slowroll', status: 'completed', finishedAt: new Date(),
      spec: storedSpec(groupId, { axes }), note: '', totalPoints: small.size, donePoints: small.size - 1, failedPoints: 1,
    });
    scanId = scan.id;
    await t.db.getRepository(ScanPoint).insert(Array.from({ length: small.size }, (_, index) => {
      const ok = index !== FAILED;
      return {
        scanId, pointIndex: index, inputs: small.point(index), status: ok ? 'ok' : 'no_end', failureReason: ok ? null : 'a failure for the test',
        ns: ok ? 0.95 + index / 100 : null, r: ok ? 0.01 : null, alphaS: null, As: null, amplitudeScale: null, nTotal: null,
        nStar: ok ? small.point(index).nStar : null, phiStar: null, phiEnd: null, energyScaleGeV: null, computedAt: new Date(),
      };
    }));
    owner = await t.signIn(DEMO.plateauMember);
  });
  afterAll(async () => {
    if (scanId) await t.db.getRepository(Scan).delete({ id: scanId });
    await t.close();
  });

  const slice = async () => {
    const res = await owner.get(`/api/scans/${scanId}/grid?x=nStar&y=f&output=ns`);
    expect(res.status).toBe(200);
    return scanGridSliceSchema.parse(res.body);
  };

  it('answers the outputs asked at once (read together) each as asked alone', async () => {
    const outputs = ['ns', 'r', 'alphaS', 'status', 'nTotal'] as const;
    const answers = await Promise.all(outputs.map((output) => owner.get(`/api/scans/${scanId}/grid?x=nStar&y=f&output=${output}&maxCells=2`)));
    const [ns, r, alphaS, status, nTotal] = answers.map((res) => {
      expect(res.status).toBe(200);
      return scanGridSliceSchema.parse(res.body);
    });
    // N_* in blocks of 2 (50–55, 60), f one value per cell; the OK points of each cell, row by row.
    const okPoints = [[0, 1], [2], [3], [5]];
    for (const slice of [ns, r, alphaS, status, nTotal]) {
      expect(slice.ok).toEqual([2, 1, 1, 1]);
      expect(slice.failed).toEqual({ no_end: [0, 0, 1, 0] });
    }
    expect(ns.output).toBe('ns');
    expect(ns.mean).toEqual(okPoints.map((points) => roundForSlice(points.reduce((sum, i) => sum + 0.95 + i / 100, 0) / points.length)));
    expect(ns.min).toEqual(okPoints.map((points) => roundForSlice(0.95 + points[0] / 100)));
    expect(ns.max).toEqual(okPoints.map((points) => roundForSlice(0.95 + points.at(-1)! / 100)));
    const all = (value: number | null) => [value, value, value, value];
    expect(r).toMatchObject({ output: 'r', mean: all(0.01), min: all(0.01), max: all(0.01) });
    expect(alphaS).toMatchObject({ output: 'alphaS', mean: all(null), min: all(null), max: all(null) });
    expect(nTotal).toMatchObject({ output: 'nTotal', mean: all(null) });
    expect(status.output).toBe('status');
    expect(status.mean).toBeUndefined();
  });

  it('reads a finished scan once, and afresh after a retry reopens it and after it finishes again', async () => {
    const first = await slice();
    expect(first.failed).toEqual({ no_end: [0, 0, 0, 0, 1, 0] });
    expect(first.mean![0]).toBe(0.95);

    // Written behind the API's back (a finished scan's points never change so): the kept slice still answers.
    await t.db.getRepository(ScanPoint).update({ scanId, pointIndex: 0 }, { ns: 0.9 });
    expect(await slice()).toEqual(first);

    // A retry deletes the failed point and reopens the scan: its slice is read again.
    const retried = await owner.post(`/api/scans/${scanId}/retry`).send({});
    expect(retried.status).toBe(200);
    expect(retried.body.status).toBe('running');
    const reopened = await slice();
    expect(reopened.failed).toEqual({});
    expect(reopened.mean![0]).toBe(0.9);
    expect(reopened.mean![FAILED]).toBeNull();

    // Finished again (here by a cancel, which also removes the retry's queued chunk): read afresh, then kept.
    expect((await owner.post(`/api/scans/${scanId}/cancel`).send({})).status).toBe(200);
    await t.db.getRepository(ScanPoint).update({ scanId, pointIndex: 1 }, { ns: 0.9 });
    const finished = await slice();
    expect(finished.mean!.slice(0, 2)).toEqual([0.9, 0.9]);
    await t.db.getRepository(ScanPoint).update({ scanId, pointIndex: 1 }, { ns: 0.8 });
    expect(await slice()).toEqual(finished);
  });
});
