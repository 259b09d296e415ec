import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import type { ChildProcess } from 'node:child_process';
import {
  boundaryDistance, boundaryLevel, crossingsAlong, deltaChi2, findLikelihoodSet, levelLine, nodeKey, RefinementLattice, RefinementMesh, ScanGrid, type ScanAxis,
  type StoredScanSpec,
} from '@sixtyfold/shared';
import { Group } from '../src/groups/entities/group.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { User } from '../src/users/entities/user.entity';
import { storedSpec } from './support/stored-spec';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { until } from './support/until';
import { startWorkers, stopWorkers } from './support/workers';

// Adaptive refinement end to end: a small T-model grid computed by real workers, refined at the
// 95 % boundary of planck18-bk18 with factor 2 to depth 2; each level is a scan on the same queue,
// chained by the API when the one before completes. The refined boundary must agree with a uniform
// grid at the finest resolution (computed by the same workers) to within one fine cell.

const ALPHA: ScanAxis = { kind: 'range', parameter: 'alpha', min: 0.1, max: 100, count: 9, spacing: 'log' };
const N_STAR: ScanAxis = { kind: 'range', parameter: 'nStar', min: 45, max: 65, count: 5, spacing: 'linear' };
const BOUNDARY = { kind: 'likelihood', likelihood: 'planck18-bk18', level: 95 } as const;
const set = findLikelihoodSet('planck18-bk18')!;

describe('refining a grid scan where a boundary crosses it', () => {
  let t: TestApp;
  let workers: ChildProcess[] = [];
  let groupId: number;
  const made: number[] = [];
  /** The refined chain the second test builds (parent, then its levels), read again by the merged-table tests. */
  let refinedChain: { parentId: number; levelIds: number[] } | undefined;

  const gridBody = (name: string, axes: ScanAxis[]) => ({
    groupId, name, model: { kind: 'family', family: 'alpha-t' }, params: { n: 1 }, axes, pivot: { kind: 'fixed' }, method: 'slowroll',
  });

  beforeAll(async () => {
    // The API follows finished levels at its reconcile interval: every second here.
    t = await createTestApp({ RECONCILE_INTERVAL_SECONDS: '1' });
    groupId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    workers = startWorkers(2);
  });
  afterAll(async () => {
    await stopWorkers(workers);
    // Levels first: they follow their parents.
    for (const id of [...made].reverse()) await t.db.getRepository(Scan).delete({ id });
    await t.close();
  });

  async function completed(agent: Awaited<ReturnType<TestApp['signIn']>>, id: number) {
    return until(async () => {
      const res = await agent.get(`/api/scans/${id}`);
      return res.body.status === 'completed' ? res.body : undefined;
    }, `scan ${id} to complete`);
  }

  /** Δχ² − 6.18 of each stored OK point, by finest-lattice key, from the rows themselves. */
  async function storedField(scanId: number, place: (index: number) => number[]): Promise<Map<string, number>> {
    const rows: { point_index: number; ns: number; r: number; alpha_s: number | null }[] = await t.db.query(
      "SELECT point_index, ns, r, alpha_s FROM scan_points WHERE scan_id = ? AND status = 'ok'", [scanId],
    );
    const out = new Map<string, number>();
    for (const row of rows) out.set(nodeKey(place(Number(row.point_index))), boundaryDistance(BOUNDARY, deltaChi2(set, { ns: row.ns, r: row.r, alphaS: row.alpha_s })?.deltaChi2)!);
    return out;
  }

  it('refuses what it cannot refine, with the reason and the field', async () => {
    const member = await t.signIn(DEMO.plateauMember);
    const viewer = await t.signIn(DEMO.plateauViewer);
    const owner = await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauMember });
    const running = await t.db.getRepository(Scan).save({
      groupId, ownerId: owner.id, name: 'refinement: running', method: 'slowroll', status: 'running', note: '', totalPoints: 4,
      spec: storedSpec(groupId),
    });
    made.push(running.id);
    const body = { boundary: BOUNDARY, depth: 2 };
    const busy = await member.post(`/api/scans/${running.id}/refine`).send(body);
    expect(busy.status).toBe(409);
    expect(busy.body.message).toMatch(/is running: only a completed scan can be refined/);
    await t.db.getRepository(Scan).update({ id: running.id }, { status: 'completed' });
    const deep = await member.post(`/api/scans/${running.id}/refine`).send({ ...body, depth: 5 });
    expect(deep.status).toBe(400);
    expect(deep.body.fieldErrors.depth).toEqual(['the depth is at most 4']);
    const unknownAxis = await member.post(`/api/scans/${running.id}/refine`).send({ ...body, factors: { alpha: 2 } });
    expect(unknownAxis.status).toBe(400);
    expect(unknownAxis.body.fieldErrors['factors.alpha'][0]).toMatch(/the scan has no axis alpha; its axes are f, nStar/);
    const regions = await member.post(`/api/scans/${running.id}/refine`).send({ ...body, boundary: { ...BOUNDARY, likelihood: 'regions:1' } });
    expect(regions.status).toBe(400);
    expect(regions.body.fieldErrors['boundary.likelihood'][0]).toMatch(/needs a likelihood set/);
    const level = await member.post(`/api/scans/${running.id}/refine`).send({ ...body, boundary: { ...BOUNDARY, level: 90 } });
    expect(level.status).toBe(400);
    expect(level.body.fieldErrors['boundary.level']).toEqual(['the level is 68 or 95 (%)']);
    const byViewer = await viewer.post(`/api/scans/${running.id}/refine`).send(body);
    expect(byViewer.status).toBe(403);
    expect(byViewer.body.message).toMatch(/needs the member role/);
  });

  it('computes the levels on the workers, chains them once each, merges them, and finds the uniform fine grid\'s boundary within one fine cell', async () => {
    const member = await t.signIn(DEMO.plateauMember);
    const parentRes = await member.post('/api/scans').send(gridBody('refinement: T-model 9 × 5', [ALPHA, N_STAR]));
    expect(parentRes.status).toBe(201);
    const parentId = parentRes.body.id as number;
    made.push(parentId);
    // The uniform grid at the finest resolution of depth 2, factor 2: (9 − 1)·4 + 1 = 33 by (5 − 1)·4 + 1 = 17.
    const fineAxes = [{ ...ALPHA, count: 33 }, { ...N_STAR, count: 17 }];
    const uniformRes = await member.post('/api/scans').send(gridBody('refinement: T-model 33 × 17', fineAxes));
    expect(uniformRes.status).toBe(201);
    made.push(uniformRes.body.id);
    await completed(member, parentId);

    const estimate = await member.get(`/api/scans/${parentId}/refine/estimate?boundary=likelihood&likelihood=planck18-bk18&level=95&factor.alpha=2&factor.nStar=2&depth=2`);
    expect(estimate.status).toBe(200);
    expect(estimate.body).toMatchObject({ level: 1, cells: 32, parentPoints: 45, finestLengths: [33, 17] });
    expect(estimate.body.crossedCells).toBeGreaterThan(0);
    expect(estimate.body.points).toBeGreaterThan(0);
    expect(estimate.body.pointsPerSecond).toBeGreaterThan(0);

    const refined = await member.post(`/api/scans/${parentId}/refine`).send({ boundary: BOUNDARY, factors: { alpha: 2, nStar: 2 }, depth: 2 });
    expect(refined.status).toBe(201);
    expect(refined.body.totalPoints).toBe(estimate.body.points);
    expect(refined.body.spec.refinement).toMatchObject({ parentScanId: parentId, level: 1, depth: 2, factors: [2, 2], boundary: { ...BOUNDARY, likelihood: 'planck18-bk18@1' } });
    expect(refined.body.spec.pointList.columns).toEqual(['alpha', 'nStar']);
    made.push(refined.body.id);

    // Level 1 completes on the workers; the API then creates level 2 from the merged mesh, which completes too.
    const lineage = await until(async () => {
      const res = await member.get(`/api/scans/${parentId}/lineage`);
      const levels = res.body.levels as { scanId: number; level: number; status: string }[];
      return levels.length === 2 && levels.every((l) => l.status === 'completed') ? res.body : undefined;
    }, 'both levels to complete', 180_000);
    expect(lineage).toMatchObject({ parentScanId: null, level: null });
    expect(lineage.levels.map((l: { level: number }) => l.level)).toEqual([1, 2]);
    const levelIds = lineage.levels.map((l: { scanId: number }) => l.scanId) as number[];
    made.push(levelIds[1]);
    refinedChain = { parentId, levelIds };
    const levelTwo = await member.get(`/api/scans/${levelIds[1]}/lineage`);
    expect(levelTwo.body).toMatchObject({ parentScanId: parentId, level: 2 });
    // Followed once: several more passes of the follower create nothing more (depth reached).
    await new Promise((r) => setTimeout(r, 3000));
    const chain = await t.db.getRepository(Scan).find({ where: { refinesScanId: parentId } });
    expect(chain.map((s) => s.refinementLevel).sort()).toEqual([1, 2]);
    expect(chain.every((s) => s.refinementFollowedAt !== null)).toBe(true);
    // Every finished level followed: the lineage says the chain will not grow.
    expect((await member.get(`/api/scans/${parentId}/lineage`)).body.chaining).toBe(false);
    const audit: { n: string }[] = await t.db.query("SELECT COUNT(*) AS n FROM audit_events WHERE action = 'scan.refine' AND target_id = ?", [String(parentId)]);
    expect(Number(audit[0].n)).toBe(1);

    // The merged constraints: marginals on the finest values, the levels named.
    const merged = await member.get(`/api/scans/${parentId}/constraints?likelihood=planck18-bk18`);
    expect(merged.status).toBe(200);
    expect(merged.body.refinement).toMatchObject({ parentScanId: parentId, levelScanIds: levelIds, marginalLevel: 2 });
    expect(merged.body.marginals[0].values).toHaveLength(33);
    expect(merged.body.evidence.lnZ).toBeLessThan(0);
    const levelView = await member.get(`/api/scans/${levelIds[0]}/constraints?likelihood=planck18-bk18`);
    expect(levelView.status).toBe(200);
    expect(levelView.body.evidence.lnZ).toBeCloseTo(merged.body.evidence.lnZ, 12);
    // Every level's points in one table, the parent's first, each naming its scan and level.
    const table = await member.get(`/api/scans/${parentId}/refinement/points?pageSize=500`);
    expect(table.status).toBe(200);
    const levelPoints = chain.reduce((n, s) => n + s.totalPoints, 0);
    expect(table.body.total).toBe(45 + levelPoints);
    expect(table.body.levelScanIds).toEqual(levelIds);
    expect(table.body.items.slice(0, 45).every((p: { scanId: number; level: number }) => p.scanId === parentId && p.level === 0)).toBe(true);
    expect(table.body.items.at(-1)).toMatchObject({ scanId: levelIds[1], level: 2, pointIndex: chain.find((s) => s.id === levelIds[1])!.totalPoints - 1 });
    expect((await member.get(`/api/scans/${uniformRes.body.id}/refinement/points`)).status).toBe(409);

    // The parent's heatmap gains the levels' cells, finer over coarser, on the finest lattice (4 fine nodes per parent index).
    const slice = await member.get(`/api/scans/${parentId}/grid?x=alpha&y=nStar&output=r`);
    expect(slice.status).toBe(200);
    expect(slice.body.refined.scale).toEqual([4, 4]);
    type Cell = { level: number; x: [number, number]; y: [number, number]; corners: [number | null, number | null, number | null, number | null]; failure: string | null };
    const cells = slice.body.refined.cells as Cell[];
    expect(cells.length).toBeGreaterThan(0);
    for (const c of cells) expect(c.x[1] - c.x[0]).toBe(c.level === 1 ? 2 : 1);
    expect(cells.every((c) => c.corners.every((v) => v !== null && v > 0) && c.failure === null)).toBe(true);
    // Swapped axes: the same cells transposed, their corners too (x fastest: the middle two change places).
    const swapped = await member.get(`/api/scans/${parentId}/grid?x=nStar&y=alpha&output=r`);
    expect(swapped.body.refined.cells.map((c: Cell) => [c.y, c.x, [c.corners[0], c.corners[2], c.corners[1], c.corners[3]]])).toEqual(cells.map((c) => [c.x, c.y, c.corners]));
    // The status panel gains the same cells, with no values and no failures (every T-model point computes).
    const status = await member.get(`/api/scans/${parentId}/grid?x=alpha&y=nStar&output=status`);
    expect(status.body.refined.cells.map((c: Cell) => [c.x, c.y])).toEqual(cells.map((c) => [c.x, c.y]));
    expect(status.body.refined.cells.every((c: Cell) => c.corners.every((v) => v === null) && c.failure === null)).toBe(true);
    // The uniform fine grid has no refinement: its answers carry none.
    await completed(member, uniformRes.body.id);
    const uniform = await member.get(`/api/scans/${uniformRes.body.id}/constraints?likelihood=planck18-bk18`);
    expect(uniform.body.refinement).toBeUndefined();
    expect((await member.get(`/api/scans/${uniformRes.body.id}/grid?x=alpha&y=nStar&output=r`)).body.refined).toBeUndefined();

    // The 95 % line the parent's heatmap draws (its Δχ² slice's refined cells, contoured cell by cell) runs
    // through the uniform 33 × 17 grid's own cells where it is refined: the same pieces, in finest-lattice coordinates.
    const threshold = boundaryLevel(BOUNDARY);
    const drawn = await member.get(`/api/scans/${parentId}/grid?x=alpha&y=nStar&output=deltaChi2&likelihood=planck18-bk18`);
    const finest = (drawn.body.refined.cells as Cell[]).filter((c) => c.level === 2);
    const refinedLine = levelLine(finest.map((c) => ({ x: c.x, y: c.y, corners: c.corners })), threshold);
    const uniformSlice = (await member.get(`/api/scans/${uniformRes.body.id}/grid?x=alpha&y=nStar&output=deltaChi2&likelihood=planck18-bk18`)).body;
    const at = (i: number, j: number) => uniformSlice.mean[j * 33 + i] as number | null;
    const uniformQuads = [];
    for (let i = 0; i < 32; i++) for (let j = 0; j < 16; j++) uniformQuads.push({ x: [i, i + 1] as const, y: [j, j + 1] as const, corners: [at(i, j), at(i + 1, j), at(i, j + 1), at(i + 1, j + 1)] as const });
    const uniformLine = levelLine(uniformQuads, threshold);
    expect(refinedLine.length).toBeGreaterThan(0);
    expect(refinedLine).toHaveLength(uniformLine.length);
    for (const segment of refinedLine) {
      const twin = uniformLine.find((u) => u.every((v, k) => Math.abs(v - segment[k]) < 1e-3));
      expect(twin).toBeDefined();
    }

    // The boundary: along every fine row of N_*, the crossings of the merged mesh against the uniform 33 × 17 grid's.
    const levels = await t.db.getRepository(Scan).find({ where: { refinesScanId: parentId }, order: { refinementLevel: 'ASC' } });
    const lattice = new RefinementLattice([ALPHA, N_STAR], [2, 2], 2);
    const mesh = new RefinementMesh(lattice, levels.map((s) => (s.spec as StoredScanSpec).refinement!.cells));
    const parentGrid = new ScanGrid([ALPHA, N_STAR]);
    const field = await storedField(parentId, (i) => lattice.toFinest(0, parentGrid.indices(i)));
    for (const level of levels) {
      const block = (level.spec as StoredScanSpec).refinement!;
      for (const [key, value] of await storedField(level.id, (i) => lattice.toFinest(block.level, block.lattice[i]))) field.set(key, value);
    }
    const fineLattice = new RefinementLattice(fineAxes, [2, 2], 1);
    const fineGrid = new ScanGrid(fineAxes);
    const fineField = await storedField(uniformRes.body.id, (i) => fineLattice.toFinest(0, fineGrid.indices(i)));
    const fineMesh = new RefinementMesh(fineLattice, []);
    const cell = Math.log10(1000) / 32;
    let compared = 0;
    for (let j = 0; j < 17; j++) {
      const nStar = N_STAR.min + ((N_STAR.max - N_STAR.min) * j) / 16;
      const refinedCrossings = crossingsAlong(mesh, (key) => field.get(key) ?? null, nStar).map(Math.log10);
      const uniformCrossings = crossingsAlong(fineMesh, (key) => fineField.get(key) ?? null, nStar).map(Math.log10);
      expect(refinedCrossings).toHaveLength(uniformCrossings.length);
      refinedCrossings.forEach((x, k) => expect(Math.abs(x - uniformCrossings[k])).toBeLessThanOrEqual(cell));
      // Closer still: the finest leaves the boundary crosses are the uniform grid's own cells, with the same corner points.
      refinedCrossings.forEach((x, k) => expect(Math.abs(x - uniformCrossings[k])).toBeLessThan(1e-9));
      compared += uniformCrossings.length;
    }
    expect(compared).toBeGreaterThan(0);
    // Fewer points than the uniform fine grid.
    expect(45 + levels.reduce((n, s) => n + s.totalPoints, 0)).toBeLessThan(33 * 17);
  }, 300_000);
  describe('the merged points table, sorted and filtered in SQL like a scan\'s points', () => {
    type Row = { scanId: number; level: number; pointIndex: number; inputs: Record<string, number>; status: string; ns: number | null; deltaChi2?: number | null };
    const key = (row: Row) => `${row.scanId}:${row.pointIndex}`;

    /** Every row of the merged table under `query`, read a page of 40 at a time (so the pages are checked to join up). */
    async function allRows(agent: Awaited<ReturnType<TestApp['signIn']>>, parentId: number, query: string): Promise<{ rows: Row[]; total: number }> {
      const rows: Row[] = [];
      let total = 0;
      for (let page = 1; ; page++) {
        const res = await agent.get(`/api/scans/${parentId}/refinement/points?pageSize=40&page=${page}${query && `&${query}`}`);
        expect(res.status).toBe(200);
        total = res.body.total;
        rows.push(...res.body.items);
        if (res.body.items.length < 40) break;
      }
      expect(rows).toHaveLength(total);
      return { rows, total };
    }

    /** Ascending by `value` (NULL first, as MariaDB sorts it), ties by the chain's order of scans, then point index. */
    function sortedBy(rows: Row[], chainIds: number[], value: (row: Row) => number | null): Row[] {
      const rank = (v: number | null) => (v === null ? -Infinity : v);
      return [...rows].sort((a, b) => rank(value(a)) - rank(value(b)) || chainIds.indexOf(a.scanId) - chainIds.indexOf(b.scanId) || a.pointIndex - b.pointIndex);
    }

    it('sorts by an output across every level, both ways, the same as sorting all the rows', async () => {
      expect(refinedChain).toBeDefined();
      const { parentId, levelIds } = refinedChain!;
      const chainIds = [parentId, ...levelIds];
      const member = await t.signIn(DEMO.plateauMember);
      const unsorted = await allRows(member, parentId, '');
      // The default order: level, then point index.
      expect(unsorted.rows.map(key)).toEqual(sortedBy(unsorted.rows, chainIds, () => 0).map(key));

      const ascending = await allRows(member, parentId, 'sort=ns&order=asc');
      expect(ascending.total).toBe(unsorted.total);
      const expected = sortedBy(unsorted.rows, chainIds, (row) => row.ns);
      expect(ascending.rows.map(key)).toEqual(expected.map(key));
      // The sort mixes the levels: it is not the default order.
      expect(ascending.rows.map(key)).not.toEqual(unsorted.rows.map(key));
      const descending = await allRows(member, parentId, 'sort=ns&order=desc');
      expect(descending.rows.map(key)).toEqual([...expected].reverse().map(key));
      // Sorting by an axis input reads every level's value of it.
      const byAlpha = await allRows(member, parentId, 'sort=input.alpha&order=desc');
      expect(byAlpha.rows.map(key)).toEqual(sortedBy(unsorted.rows, chainIds, (row) => row.inputs.alpha).reverse().map(key));
    });

    it('filters by an output and an input range on every level, with the matching total', async () => {
      const { parentId, levelIds } = refinedChain!;
      const member = await t.signIn(DEMO.plateauMember);
      const unsorted = await allRows(member, parentId, '');
      // A window around the finest level's n_s values, and α above the median of that level's.
      const finest = unsorted.rows.filter((row) => row.scanId === levelIds[1] && row.ns !== null);
      const ns = finest.map((row) => row.ns!).sort((a, b) => a - b);
      const alphas = finest.map((row) => row.inputs.alpha).sort((a, b) => a - b);
      const [nsMin, nsMax, alphaMin] = [ns[0], ns.at(-1)!, alphas[Math.floor(alphas.length / 2)]];
      const expected = unsorted.rows.filter((row) => row.ns !== null && row.ns >= nsMin && row.ns <= nsMax && row.inputs.alpha >= alphaMin);
      expect(expected.length).toBeGreaterThan(0);
      expect(expected.length).toBeLessThan(unsorted.total);
      expect(new Set(expected.map((row) => row.level)).size).toBeGreaterThan(1);

      const filtered = await allRows(member, parentId, `ns_min=${nsMin}&ns_max=${nsMax}&input.alpha_min=${alphaMin}`);
      expect(filtered.total).toBe(expected.length);
      expect(filtered.rows.map(key)).toEqual(expected.map(key));
      // A status filter reads every level too.
      const ok = await allRows(member, parentId, 'status=ok');
      expect(ok.rows.map(key)).toEqual(unsorted.rows.filter((row) => row.status === 'ok').map(key));
    });

    it('sorts and filters by Δχ² under a likelihood set, and names the set', async () => {
      const { parentId, levelIds } = refinedChain!;
      const chainIds = [parentId, ...levelIds];
      const member = await t.signIn(DEMO.plateauMember);
      const judged = await member.get(`/api/scans/${parentId}/refinement/points?likelihood=planck18-bk18&sort=deltaChi2&pageSize=1000`);
      expect(judged.status).toBe(200);
      expect(judged.body.judgedBy).toBe('planck18-bk18@1');
      const rows = judged.body.items as Row[];
      expect(rows.every((row) => row.status !== 'ok' || typeof row.deltaChi2 === 'number')).toBe(true);
      expect(rows.map(key)).toEqual(sortedBy(rows, chainIds, (row) => row.deltaChi2 ?? null).map(key));
      // Inside the 95 % region: Δχ² ≤ 6.18, on every level that has such points.
      const inside = await allRows(member, parentId, 'likelihood=planck18-bk18&deltaChi2_max=6.18');
      const expected = rows.filter((row) => row.deltaChi2 !== null && row.deltaChi2! <= 6.18);
      expect(expected.length).toBeGreaterThan(0);
      expect(inside.total).toBe(expected.length);
      expect(new Set(inside.rows.map(key))).toEqual(new Set(expected.map(key)));
    });

    it('refuses an input the grid does not vary, and a download, naming the field', async () => {
      const { parentId } = refinedChain!;
      const member = await t.signIn(DEMO.plateauMember);
      const sort = await member.get(`/api/scans/${parentId}/refinement/points?sort=input.phi`);
      expect(sort.status).toBe(400);
      expect(sort.body.fieldErrors.sort).toEqual(['the scan has no axis phi; its axes are alpha, nStar']);
      const range = await member.get(`/api/scans/${parentId}/refinement/points?input.beta_min=1`);
      expect(range.status).toBe(400);
      expect(range.body.fieldErrors['input.beta_min']).toEqual(['the scan has no axis beta; its axes are alpha, nStar']);
      const unjudged = await member.get(`/api/scans/${parentId}/refinement/points?sort=deltaChi2`);
      expect(unjudged.status).toBe(400);
      expect(unjudged.body.fieldErrors.sort[0]).toMatch(/name the likelihood set too/);
      const download = await member.get(`/api/scans/${parentId}/refinement/points?format=csv`);
      expect(download.status).toBe(400);
      expect(download.body.fieldErrors.format[0]).toMatch(/pages only/);
    });
  });
});
