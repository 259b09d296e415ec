import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { ScanGrid } from '@sixtyfold/shared';
import { Group } from '../src/groups/entities/group.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { User } from '../src/users/entities/user.entity';
import { storedSpec } from './support/stored-spec';
import { createTestApp, DEMO, type TestApp } from './support/test-app';

// The constraints of a grid scan through the API, on stored outputs built so that the answer has
// a closed form: under Planck 2018 + BICEP/Keck 2018 (n_s = 0.9649 ± 0.0042, no α_s), a point with
// n_s = 0.9649 + 0.0042 (x − 0.5)/0.1 and r = 0 has Δχ² = ((x − 0.5)/0.1)², so the posterior in x is a
// Gaussian of mean 0.5 and σ 0.1 and y is flat.

const AXES = [
  { kind: 'range' as const, parameter: 'x', min: 0, max: 1, count: 201, spacing: 'linear' as const },
  { kind: 'range' as const, parameter: 'y', min: 0, max: 1, count: 51, spacing: 'linear' as const },
];
const POINTS = 201 * 51;
// Every 97th point failed: left out and counted, not read as zero likelihood.
const failed = (i: number) => i % 97 === 13;

describe('constraints of a grid scan', () => {
  let t: TestApp;
  let scan: Scan;
  let listScan: Scan;

  beforeAll(async () => {
    t = await createTestApp();
    const groupId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    const ownerId = (await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauMember })).id;
    const bad = Array.from({ length: POINTS }, (_, i) => i).filter(failed).length;
    const spec = storedSpec(groupId, { axes: AXES, pivot: { kind: 'fixed', nStar: 55 } });
    scan = await t.db.getRepository(Scan).save({
      groupId, ownerId, name: 'constraints', method: 'slowroll', status: 'completed', note: '', spec, totalPoints: POINTS, donePoints: POINTS - bad, failedPoints: bad,
    });
    listScan = await t.db.getRepository(Scan).save({
      groupId, ownerId, name: 'constraints of a list', method: 'slowroll', status: 'completed', note: '', totalPoints: 2, donePoints: 0, failedPoints: 0,
      spec: storedSpec(groupId, { axes: undefined, pointList: { columns: ['f', 'nStar'], rows: [[5, 50], [7, 60]] } }),
    });
    const grid = new ScanGrid(AXES);
    for (let start = 0; start < POINTS; start += 2000) {
      const rows: unknown[][] = [];
      for (let i = start; i < Math.min(POINTS, start + 2000); i++) {
        const { x, y } = grid.point(i);
        rows.push(failed(i)
          ? [scan.id, i, JSON.stringify({ x, y }), x, y, 'no_end', null, null, new Date()]
          : [scan.id, i, JSON.stringify({ x, y }), x, y, 'ok', 0.9649 + (0.0042 * (x - 0.5)) / 0.1, 0, new Date()]);
      }
      await t.db.query(`INSERT INTO scan_points (scan_id, point_index, inputs, axis_0, axis_1, status, ns, r, computed_at) VALUES ${rows.map(() => '(?, ?, ?, ?, ?, ?, ?, ?, ?)').join(', ')}`, rows.flat());
    }
  }, 60_000);
  afterAll(async () => {
    for (const s of [scan, listScan]) if (s) await t.db.getRepository(Scan).delete({ id: s.id });
    await t.close();
  });

  it('gives the Gaussian posterior its ±1σ interval, the flat axis its edge warning, and the evidence its closed form', async () => {
    const member = await t.signIn(DEMO.plateauMember);
    const res = await member.get(`/api/scans/${scan.id}/constraints?likelihood=planck18-bk18`);
    expect(res.status).toBe(200);
    expect(res.body.likelihood).toMatchObject({ key: 'planck18-bk18', version: 1, builtIn: true });
    const x = res.body.constraints.find((c: { axis: string }) => c.axis === 'x');
    const x68 = x.intervals.find((i: { level: number }) => i.level === 0.68);
    // A Gaussian's central 68 % is ±0.994σ (closed form: Φ⁻¹(0.84) = 0.9945), to the grid's resolution of 0.005.
    expect(x68.kind).toBe('two-sided');
    expect(Math.abs(x68.lower - (0.5 - 0.09945))).toBeLessThan(0.005);
    expect(Math.abs(x68.upper - (0.5 + 0.09945))).toBeLessThan(0.005);
    expect(x.edgeWarning).toBeNull();
    // y is flat: its 95 % region reaches both ends of the axis.
    const y = res.body.constraints.find((c: { axis: string }) => c.axis === 'y');
    expect(y.edgeWarning).toMatch(/the 95 ?% region reaches y = 0 and y = 1, the end of the axis: widen it/);
    // Z = mean of L over the prior box = ∫₀¹ exp(−(x − 0.5)²/(2 · 0.1²)) dx = 0.1 √(2π) (1 − 2Φ(−5)) ≈ 0.250663 (closed form).
    expect(Math.abs(res.body.evidence.lnZ - Math.log(0.1 * Math.sqrt(2 * Math.PI)))).toBeLessThan(1e-3);
    expect(res.body.excluded.count).toBe(Array.from({ length: POINTS }, (_, i) => i).filter(failed).length);
    expect(res.body.bestFit.inputs.x).toBe(0.5);
    expect(res.body.pair).toMatchObject({ x: 'x', y: 'y' });
  });

  it('compares evidence: the same points in two scans give ln B = 0, ranked, in the words of Kass & Raftery', async () => {
    // A second scan with the same stored outputs (copied): its evidence equals the first's, so ln B = 0 exactly.
    const { groupId, ownerId, method, status, note, spec, totalPoints, donePoints, failedPoints } = scan;
    const twin = await t.db.getRepository(Scan).save({ groupId, ownerId, method, status, note, spec, totalPoints, donePoints, failedPoints, name: 'constraints twin' });
    try {
      await t.db.query(
        'INSERT INTO scan_points (scan_id, point_index, inputs, axis_0, axis_1, status, ns, r, computed_at) SELECT ?, point_index, inputs, axis_0, axis_1, status, ns, r, computed_at FROM scan_points WHERE scan_id = ?',
        [twin.id, scan.id],
      );
      const member = await t.signIn(DEMO.plateauMember);
      const res = await member.get(`/api/scans/evidence?ids=${scan.id},${twin.id}&likelihoods=planck18-bk18,pact-lb-bk18`);
      expect(res.status).toBe(200);
      expect(res.body.referenceId).toBe(scan.id);
      expect(res.body.note).toMatch(/prior/);
      expect(res.body.sets.map((s: { likelihood: { key: string } }) => s.likelihood.key)).toEqual(['planck18-bk18', 'pact-lb-bk18']);
      for (const set of res.body.sets) {
        const twinRow = set.scans.find((row: { scanId: number }) => row.scanId === twin.id);
        expect(twinRow.lnB).toBe(0);
        expect(twinRow.verdict).toBe(`no preference between scan ${twin.id} and scan ${scan.id}`);
        expect(set.scans.map((row: { rank: number }) => row.rank)).toEqual([1, 2]);
      }
      // Under P-ACT-LB (n_s = 0.974 ± 0.003) the same points fit worse than under Planck (their n_s centres on 0.9649).
      expect(res.body.sets[1].scans[0].lnZ).toBeLessThan(res.body.sets[0].scans[0].lnZ);
      const wrongReference = await member.get(`/api/scans/evidence?ids=${scan.id}&reference=${twin.id}`);
      expect([wrongReference.status, wrongReference.body.fieldErrors?.reference]).toEqual([400, ['the reference must be one of the scans compared']]);
    } finally {
      await t.db.getRepository(Scan).delete({ id: twin.id });
    }
  });

  it('gives the marginals as CSV, and refuses what it cannot answer', async () => {
    const member = await t.signIn(DEMO.plateauMember);
    const csv = await member.get(`/api/scans/${scan.id}/constraints?likelihood=planck18-bk18&format=csv`);
    expect(csv.status).toBe(200);
    const lines = csv.text.trim().split('\n');
    expect(lines[0]).toBe('axis,prior,value,mass,density');
    expect(lines).toHaveLength(1 + 201 + 51);
    const badPrior = await member.get(`/api/scans/${scan.id}/constraints?likelihood=planck18-bk18&prior.z=log`);
    expect([badPrior.status, badPrior.body.fieldErrors?.['prior.z']]).toEqual([400, ['the scan has no axis z; its axes are x, y']]);
    const noSet = await member.get(`/api/scans/${scan.id}/constraints`);
    expect(noSet.status).toBe(400);
    expect((await member.get(`/api/scans/${listScan.id}/constraints?likelihood=planck18-bk18`)).status).toBe(409);
  });
});
