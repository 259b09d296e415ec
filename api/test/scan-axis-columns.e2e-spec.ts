import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { ScanGrid, scanPointsQuerySchema } from '@sixtyfold/shared';
import { PointAxisColumns1796300000020 } from '../src/database/migrations/1796300000020-PointAxisColumns';
import { LeanPointIndexes1796300000021 } from '../src/database/migrations/1796300000021-LeanPointIndexes';
import { Group } from '../src/groups/entities/group.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { ScanResultsService } from '../src/scans/scan-results.service';
import { User } from '../src/users/entities/user.entity';
import { storedSpec } from './support/stored-spec';
import { createTestApp, DEMO, type TestApp } from './support/test-app';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

// 40 values of f × 500 of N_*: enough points that MariaDB's plan for a page is the one it takes
// for a large scan, and sorting by N_* (the inner axis) is far from point-index order.
const AXES = [
  { kind: 'range' as const, parameter: 'f', min: 5, max: 10, count: 40, spacing: 'linear' as const },
  { kind: 'range' as const, parameter: 'nStar', min: 45, max: 65, count: 500, spacing: 'linear' as const },
];
const POINTS = 40 * 500;

describe('axis inputs as indexed columns of scan_points', () => {
  let t: TestApp;
  let member: Agent;
  let scan: Scan;

  beforeAll(async () => {
    t = await createTestApp();
    member = await t.signIn(DEMO.plateauMember);
    const groupId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    const ownerId = (await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauMember })).id;
    // Every eleventh point failed: its outputs are null, so an output sort meets nulls too.
    const failed = (i: number) => i % 11 === 3;
    const failedPoints = Array.from({ length: POINTS }, (_, i) => i).filter(failed).length;
    scan = await t.db.getRepository(Scan).save({
      groupId, ownerId, name: 'axis columns', method: 'slowroll', status: 'completed', note: '',
      spec: storedSpec(groupId, { axes: AXES }), totalPoints: POINTS, donePoints: POINTS - failedPoints, failedPoints,
    });
    // The points are stored as before the migration (no axis columns), then the migration runs.
    const migration = new PointAxisColumns1796300000020();
    const lean = new LeanPointIndexes1796300000021();
    const runner = t.db.createQueryRunner();
    try {
      await lean.down(runner);
      await migration.down(runner);
      const grid = new ScanGrid(AXES);
      for (let start = 0; start < POINTS; start += 2000) {
        const rows: unknown[][] = [];
        for (let i = start; i < start + 2000; i++) {
          const inputs = grid.point(i);
          // An n_s with ties and no relation to the point index.
          const ns = failed(i) ? null : 0.95 + ((i * 7919) % 997) / 1e5;
          rows.push([scan.id, i, JSON.stringify(inputs), failed(i) ? 'no_end' : 'ok', ns, new Date()]);
        }
        await t.db.query(
          `INSERT INTO scan_points (scan_id, point_index, inputs, status, ns, computed_at) VALUES ${rows.map(() => '(?, ?, ?, ?, ?, ?)').join(', ')}`,
          rows.flat(),
        );
      }
      await migration.up(runner);
      await lean.up(runner);
      await t.db.query('ANALYZE TABLE scan_points');
    } finally {
      await runner.release();
    }
  }, 120_000);
  afterAll(async () => {
    if (scan) await t.db.getRepository(Scan).delete({ id: scan.id });
    await t.close();
  });

  it('the migration fills axis_0 and axis_1 from the stored inputs in the order of the axes', async () => {
    const [counts] = await t.db.query(
      `SELECT COUNT(*) AS n,
              SUM(axis_0 = CAST(JSON_VALUE(inputs, '$.f') AS DOUBLE)) AS f,
              SUM(axis_1 = CAST(JSON_VALUE(inputs, '$.nStar') AS DOUBLE)) AS nStar,
              SUM(axis_2 IS NULL AND axis_3 IS NULL) AS rest
         FROM scan_points WHERE scan_id = ?`,
      [scan.id],
    );
    expect(Object.fromEntries(Object.entries(counts).map(([k, v]) => [k, Number(v)]))).toEqual({ n: POINTS, f: POINTS, nStar: POINTS, rest: POINTS });
    const [last] = await t.db.query('SELECT axis_0, axis_1 FROM scan_points WHERE scan_id = ? AND point_index = ?', [scan.id, POINTS - 1]);
    expect([last.axis_0, last.axis_1]).toEqual([10, 65]);
  });

  /** The point indices of a page, sorted and filtered through the JSON inputs as the points route did before. */
  async function byJson(order: string, where: string, page: number, pageSize: number): Promise<number[]> {
    const rows: { point_index: number }[] = await t.db.query(
      `SELECT point_index FROM scan_points WHERE scan_id = ? ${where} ORDER BY ${order} LIMIT ? OFFSET ?`,
      [scan.id, pageSize, (page - 1) * pageSize],
    );
    return rows.map((r) => Number(r.point_index));
  }
  const json = (name: string) => `CAST(JSON_VALUE(inputs, '$.${name}') AS DOUBLE)`;

  it('sorts and filters by an axis in the same order as by the JSON inputs, on the first, a middle and the last page', async () => {
    const cases = [
      { query: 'sort=input.nStar', order: `${json('nStar')} ASC, point_index ASC`, where: '' },
      { query: 'sort=input.nStar&order=desc', order: `${json('nStar')} DESC, point_index DESC`, where: '' },
      { query: 'sort=input.f&order=desc&input.nStar_min=50&input.nStar_max=52.5', order: `${json('f')} DESC, point_index DESC`, where: `AND ${json('nStar')} BETWEEN 50 AND 52.5` },
      { query: 'sort=input.nStar&input.f_max=6&status=ok', order: `${json('nStar')} ASC, point_index ASC`, where: `AND ${json('f')} <= 6 AND status = 'ok'` },
      { query: 'sort=ns&input.nStar_min=60', order: 'ns ASC, point_index ASC', where: `AND ${json('nStar')} >= 60` },
      // A filter on an observable and a sort by an input (the input read from the point index).
      { query: 'sort=input.f&ns_min=0.953&ns_max=0.957', order: `${json('f')} ASC, point_index ASC`, where: 'AND ns BETWEEN 0.953 AND 0.957' },
      { query: 'sort=input.nStar&order=desc&ns_max=0.952&input.f_min=7', order: `${json('nStar')} DESC, point_index DESC`, where: `AND ns <= 0.952 AND ${json('f')} >= 7` },
    ];
    for (const c of cases) {
      const [{ n }] = await t.db.query(`SELECT COUNT(*) AS n FROM scan_points WHERE scan_id = ? ${c.where}`, [scan.id]);
      const total = Number(n);
      expect(total).toBeGreaterThan(100);
      const lastPage = Math.ceil(total / 100);
      for (const page of [1, Math.ceil(lastPage / 2), lastPage]) {
        const res = await member.get(`/api/scans/${scan.id}/points?${c.query}&pageSize=100&page=${page}`);
        expect({ query: c.query, page, status: res.status, total: res.body.total }).toEqual({ query: c.query, page, status: 200, total });
        expect(res.body.items.map((p: { pointIndex: number }) => p.pointIndex)).toEqual(await byJson(c.order, c.where, page, 100));
      }
    }
    // Past the last page: no points, the same total.
    const past = await member.get(`/api/scans/${scan.id}/points?sort=input.nStar&pageSize=100&page=${POINTS / 100 + 1}`);
    expect({ status: past.status, items: past.body.items, total: past.body.total }).toEqual({ status: 200, items: [], total: POINTS });
    // Unfiltered, the total is the scan's stored count.
    expect((await member.get(`/api/scans/${scan.id}/points?sort=input.f&pageSize=1`)).body.total).toBe(POINTS);
  });

  it('reads a page sorted by an observable through that column\'s index', async () => {
    const service = new ScanResultsService(t.db, undefined as never, undefined as never, undefined as never);
    const explain = async (query: Record<string, string>) => {
      const [sql, parameters] = service.pageQuery(scan, scanPointsQuerySchema.parse(query), POINTS);
      return (await t.db.query(`EXPLAIN ${sql}`, parameters)) as { select_type: string; key: string | null; Extra: string | null }[];
    };
    for (const [query, key] of [
      [{ sort: 'ns', page: '199', pageSize: '100' }, 'ix_scan_points_scan_ns'],
      [{ sort: 'r', order: 'desc', page: '2', pageSize: '100' }, 'ix_scan_points_scan_r'],
    ] as const) {
      // The inner query walks the index in order (no filesort); only the page's rows are sorted again outside.
      const inner = (await explain(query)).filter((row) => row.select_type === 'DERIVED');
      expect(inner.map((row) => ({ query, key: row.key, filesort: /filesort/.test(row.Extra ?? '') }))).toEqual([{ query, key, filesort: false }]);
    }
  });

  it('reads a filter on one column and a sort on the other from one index, with the inputs from the point index', async () => {
    const service = new ScanResultsService(t.db, undefined as never, undefined as never, undefined as never);
    for (const [query, key] of [
      [{ sort: 'input.f', ns_min: '0.953', ns_max: '0.957', page: '30', pageSize: '100' }, 'ix_scan_points_scan_ns'],
      [{ sort: 'ns', 'input.nStar_min': '60', page: '20', pageSize: '100' }, 'ix_scan_points_scan_ns'],
    ] as const) {
      const [sql, parameters] = service.pageQuery(scan, scanPointsQuerySchema.parse(query), POINTS);
      const plan = (await t.db.query(`EXPLAIN ${sql}`, parameters)) as { select_type: string; key: string | null; Extra: string | null }[];
      // "Using index": the inner query reads index entries only, never a row, however many it passes over.
      const inner = plan.filter((row) => row.select_type === 'DERIVED');
      expect(inner.map((row) => ({ query, key: row.key, indexOnly: /Using index/.test(row.Extra ?? '') }))).toEqual([{ query, key, indexOnly: true }]);
    }
  });

  it('sorts and filters list axes, falling or in no order and repeating a value, as their values do', async () => {
    const groupId = scan.groupId;
    // f falls; N_* turns back and repeats 45, so only its values can order it.
    const axes = [
      { kind: 'list' as const, parameter: 'f', values: Array.from({ length: 25 }, (_, k) => 30 - k) },
      { kind: 'list' as const, parameter: 'nStar', values: [55, 45, 65, 50, 60, 45] },
    ];
    const grid = new ScanGrid(axes);
    const lists = await t.db.getRepository(Scan).save({
      groupId, ownerId: scan.ownerId, name: 'list axes', method: 'slowroll', status: 'completed', note: '',
      spec: storedSpec(groupId, { axes }), totalPoints: grid.size, donePoints: grid.size, failedPoints: 0,
    });
    try {
      const rows = Array.from({ length: grid.size }, (_, i) => {
        const inputs = grid.point(i);
        return [lists.id, i, JSON.stringify(inputs), 'ok', 0.95 + ((i * 7919) % 97) / 1e4, inputs.f, inputs.nStar, new Date()];
      });
      await t.db.query(`INSERT INTO scan_points (scan_id, point_index, inputs, status, ns, axis_0, axis_1, computed_at) VALUES ${rows.map(() => '(?, ?, ?, ?, ?, ?, ?, ?)').join(', ')}`, rows.flat());
      const cases = [
        { query: 'sort=input.f', order: `${json('f')} ASC, point_index ASC`, where: '' },
        { query: 'sort=input.f&order=desc&input.f_min=10&input.f_max=20', order: `${json('f')} DESC, point_index DESC`, where: `AND ${json('f')} BETWEEN 10 AND 20` },
        { query: 'sort=input.nStar&ns_min=0.952', order: `${json('nStar')} ASC, point_index ASC`, where: 'AND ns >= 0.952' },
        { query: 'sort=ns&input.nStar_max=52', order: 'ns ASC, point_index ASC', where: `AND ${json('nStar')} <= 52` },
        { query: 'sort=ns&input.nStar_min=70', order: 'ns ASC, point_index ASC', where: `AND ${json('nStar')} >= 70` },
      ];
      for (const c of cases) {
        const expected: { point_index: number }[] = await t.db.query(`SELECT point_index FROM scan_points WHERE scan_id = ? ${c.where} ORDER BY ${c.order}`, [lists.id]);
        const res = await member.get(`/api/scans/${lists.id}/points?${c.query}&pageSize=500`);
        expect({ query: c.query, status: res.status, total: res.body.total }).toEqual({ query: c.query, status: 200, total: expected.length });
        expect(res.body.items.map((p: { pointIndex: number }) => p.pointIndex)).toEqual(expected.map((r) => Number(r.point_index)));
      }
    } finally {
      await t.db.getRepository(Scan).delete({ id: lists.id });
    }
  });

  it('reads a page of a complete grid sorted by an axis input by primary key alone, sorting nothing', async () => {
    // Every row a handler reads, by key, next, previous or scan, counted by the server for all sessions.
    const rowsRead = async () => ((await t.db.query("SHOW GLOBAL STATUS LIKE 'Handler_read%'")) as { Value: string }[]).reduce((n, row) => n + Number(row.Value), 0);
    for (const query of ['sort=input.nStar&page=100', 'sort=input.f&order=desc&page=57']) {
      const before = await rowsRead();
      const res = await member.get(`/api/scans/${scan.id}/points?${query}&pageSize=100`);
      expect(res.status).toBe(200);
      expect(res.body.items).toHaveLength(100);
      // The page's 100 rows and a few of the scan's and the session's; a sort would read all 20,000 points.
      expect({ query, read: (await rowsRead()) - before < 1000 }).toEqual({ query, read: true });
    }
  });
});
