import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { tableFromIPC } from 'apache-arrow';
import { deltaChi2, confidenceOf, findLikelihoodSet, roundForSlice, ScanGrid } from '@sixtyfold/shared';
import { Group } from '../src/groups/entities/group.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { User } from '../src/users/entities/user.entity';
import { storedSpec } from './support/stored-spec';
import { createTestApp, DEMO, type TestApp } from './support/test-app';

// Each point judged under a likelihood set on demand, from its stored outputs (nothing is
// recomputed): its Δχ² and confidence level in the page, and sorting and filtering by Δχ².

const AXES = [
  { kind: 'range' as const, parameter: 'f', min: 5, max: 10, count: 20, spacing: 'linear' as const },
  { kind: 'range' as const, parameter: 'nStar', min: 45, max: 65, count: 20, spacing: 'linear' as const },
];
const POINTS = 400;
const failed = (i: number) => i % 37 === 4;
// Outputs spread over the plane around the Planck value: n_s from 0.95 to 0.98, r from 0 to 0.08, α_s small.
const outputs = (i: number) => ({ ns: 0.95 + ((i * 7) % 400) * 0.000075, r: ((i * 13) % 400) * 0.0002, alphaS: -0.0005 - (i % 5) * 1e-4 });

describe('points judged under a likelihood set', () => {
  let t: TestApp;
  let scan: Scan;

  beforeAll(async () => {
    t = await createTestApp();
    const groupId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    const ownerId = (await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauMember })).id;
    const bad = Array.from({ length: POINTS }, (_, i) => i).filter(failed).length;
    scan = await t.db.getRepository(Scan).save({
      groupId, ownerId, name: 'judged points', method: 'slowroll', status: 'completed', note: '',
      spec: storedSpec(groupId, { axes: AXES }), totalPoints: POINTS, donePoints: POINTS - bad, failedPoints: bad,
    });
    const grid = new ScanGrid(AXES);
    const rows = Array.from({ length: POINTS }, (_, i) => {
      const inputs = grid.point(i);
      const o = outputs(i);
      return failed(i)
        ? [scan.id, i, JSON.stringify(inputs), inputs.f, inputs.nStar, 'no_end', 'ends nowhere', null, null, null, new Date()]
        : [scan.id, i, JSON.stringify(inputs), inputs.f, inputs.nStar, 'ok', null, o.ns, o.r, o.alphaS, new Date()];
    });
    await t.db.query(
      `INSERT INTO scan_points (scan_id, point_index, inputs, axis_0, axis_1, status, failure_reason, ns, r, alpha_s, computed_at) VALUES ${rows.map(() => '(?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)').join(', ')}`,
      rows.flat(),
    );
  });
  afterAll(async () => {
    if (scan) await t.db.getRepository(Scan).delete({ id: scan.id });
    await t.close();
  });

  /** Δχ² of point i under a set by the shared function, null for a failed point. */
  const expected = (key: string, i: number) => (failed(i) ? null : deltaChi2(findLikelihoodSet(key)!, outputs(i)));

  it('gives each point its Δχ² and confidence level, as the shared functions compute them', async () => {
    const member = await t.signIn(DEMO.plateauMember);
    for (const key of ['planck18-bk18', 'planck18', 'pact-lb-bk18']) {
      const res = await member.get(`/api/scans/${scan.id}/points?likelihood=${key}&pageSize=1000`);
      expect(res.status).toBe(200);
      // Asked without a version, the answer names the one it judged with.
      expect(res.body.judgedBy).toBe(`${key}@1`);
      for (const point of res.body.items) {
        const want = expected(key, point.pointIndex);
        if (!want) {
          expect([point.deltaChi2, point.confidence]).toEqual([null, null]);
          continue;
        }
        expect(point.deltaChi2).toBeCloseTo(want.deltaChi2, 10);
        expect(point.confidence).toBeCloseTo(confidenceOf(want.deltaChi2, want.terms), 12);
      }
    }
    // Without a set the points carry neither.
    const plain = await member.get(`/api/scans/${scan.id}/points?pageSize=1`);
    expect(plain.body.items[0].deltaChi2).toBeUndefined();
  });

  it('sorts by Δχ² (failed points first, ties by index) and keeps the points inside a Δχ² bound', async () => {
    const member = await t.signIn(DEMO.plateauMember);
    // Planck alone quotes r at 0.002 Mpc⁻¹: its r term moves r from the engine's pivot, in SQL as in the shared function.
    for (const key of ['planck18-bk18', 'planck18']) {
      const order = Array.from({ length: POINTS }, (_, i) => i).sort((a, b) => {
        const [x, y] = [expected(key, a), expected(key, b)];
        if (!x || !y) return x ? 1 : y ? -1 : a - b;
        return x.deltaChi2 - y.deltaChi2 || a - b;
      });
      const pages = [];
      for (const page of [1, 2, 3, 4]) {
        const res = await member.get(`/api/scans/${scan.id}/points?likelihood=${key}&sort=deltaChi2&pageSize=100&page=${page}`);
        pages.push(...res.body.items.map((p: { pointIndex: number }) => p.pointIndex));
      }
      expect(pages).toEqual(order);

      // Inside the 95.4 % region in two parameters (Δχ² ≤ 6.18).
      const inside = Array.from({ length: POINTS }, (_, i) => i).filter((i) => (expected(key, i)?.deltaChi2 ?? Infinity) <= 6.18);
      expect(inside.length).toBeGreaterThan(10);
      const bounded = await member.get(`/api/scans/${scan.id}/points?likelihood=${key}&deltaChi2_max=6.18&pageSize=1000`);
      expect([bounded.body.total, bounded.body.items.map((p: { pointIndex: number }) => p.pointIndex)]).toEqual([inside.length, inside]);
    }
  });

  it('adds Δχ² and the confidence level as the last columns of every export format', async () => {
    const member = await t.signIn(DEMO.plateauMember);
    const key = 'pact-lb-bk18';
    const csv = await member.get(`/api/scans/${scan.id}/points?format=csv&likelihood=${key}`);
    expect(csv.headers['x-sixtyfold-judged-by']).toBe(`${key}@1`);
    expect(csv.headers['content-disposition']).toBe(`attachment; filename="scan-${scan.id}-points-judged-${key}-1.csv"`);
    const [header, ...lines] = csv.text.trim().split('\n').filter((l) => !l.startsWith('#'));
    expect(header.split(',').slice(-2)).toEqual(['deltaChi2', 'confidence']);
    for (const line of lines) {
      const cells = line.split(',');
      const want = expected(key, Number(cells[0]));
      expect(cells.at(-2)).toBe(want ? String(want.deltaChi2) : '');
    }
    const json = await member.get(`/api/scans/${scan.id}/points?format=json&likelihood=${key}`);
    expect(json.body[5]).toMatchObject({ pointIndex: 5, deltaChi2: expected(key, 5)!.deltaChi2 });
    const arrow = await member.get(`/api/scans/${scan.id}/points?format=arrow&likelihood=${key}`).buffer(true).parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
    const table = tableFromIPC(arrow.body as Buffer);
    expect(table.getChild('deltaChi2')!.get(5)).toBe(expected(key, 5)!.deltaChi2);
    expect(table.getChild('confidence')!.get(4)).toBeNull(); // point 4 failed
  });

  it('colours a heatmap by Δχ² under a set: each cell is its point\'s Δχ² (to the slice\'s 7 digits)', async () => {
    const member = await t.signIn(DEMO.plateauMember);
    const key = 'planck18';
    const res = await member.get(`/api/scans/${scan.id}/grid?x=nStar&y=f&output=deltaChi2&likelihood=${key}`);
    expect(res.status).toBe(200);
    expect(res.body.output).toBe('deltaChi2');
    const grid = new ScanGrid(AXES);
    for (let iy = 0; iy < 20; iy++) {
      for (let ix = 0; ix < 20; ix++) {
        const i = grid.indexOf([iy, ix]);
        const want = expected(key, i);
        expect(res.body.mean[iy * 20 + ix]).toBe(want ? roundForSlice(want.deltaChi2) : null);
      }
    }
    const unnamed = await member.get(`/api/scans/${scan.id}/grid?x=nStar&y=f&output=deltaChi2`);
    expect([unnamed.status, unnamed.body.fieldErrors?.likelihood]).toEqual([400, ['output=deltaChi2: name the likelihood set too, e.g. likelihood=planck18-bk18']]);
  });

  it('refuses Δχ² without a set, and names a set that does not exist', async () => {
    const member = await t.signIn(DEMO.plateauMember);
    const unnamed = await member.get(`/api/scans/${scan.id}/points?sort=deltaChi2`);
    expect([unnamed.status, unnamed.body.fieldErrors?.sort]).toEqual([400, ['sorting by deltaChi2: name the likelihood set too, e.g. likelihood=planck18-bk18']]);
    const unknown = await member.get(`/api/scans/${scan.id}/points?likelihood=no-such-set`);
    expect([unknown.status, unknown.body.message]).toEqual([404, "No likelihood set 'no-such-set'"]);
  });
});
