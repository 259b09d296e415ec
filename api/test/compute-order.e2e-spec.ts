import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { chunkSize, computeOrder, pointCount, type StoredScanSpec } from '@sixtyfold/shared';
import { Group } from '../src/groups/entities/group.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { chunkOfPointSql } from '../src/scans/chunk-of-point';
import { createTestApp, DEMO, type TestApp } from './support/test-app';

// Points that share a background (along N_*, the reheating history or the parameter that only
// scales V) are computed together: the submission names those axes in the stored spec, and the
// chunk MariaDB assigns each stored point (for reconciling and retrying) is the chunk the worker
// computes it in.

const range = (parameter: string, min: number, max: number, count: number) => ({ kind: 'range', parameter, min, max, count, spacing: 'linear' });

describe('the compute order of a scan', () => {
  let t: TestApp;
  let plateauId: number;

  beforeAll(async () => {
    t = await createTestApp();
    plateauId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
  });
  afterAll(async () => {
    await t.db.query("DELETE FROM scans WHERE name LIKE 'compute order:%'");
    await t.close();
  });

  /** Submits a scan (no worker runs here), cancels it, and returns its stored spec. */
  const submitted = async (name: string, axes: unknown[], model: unknown = { kind: 'family', family: 'monomial' }): Promise<Scan> => {
    const agent = await t.signIn(DEMO.plateauMember);
    const created = await agent.post('/api/scans').send({
      groupId: plateauId, name: `compute order: ${name}`, model, axes, method: 'slowroll',
      pivot: (axes as { parameter: string }[]).some((a) => a.parameter === 'nStar') ? { kind: 'fixed' } : { kind: 'fixed', nStar: 55 },
    });
    expect([created.status, created.body.message]).toEqual([201, undefined]);
    expect((await agent.post(`/api/scans/${created.body.id}/cancel`).send({})).status).toBe(200);
    return t.db.getRepository(Scan).findOneByOrFail({ id: created.body.id });
  };

  /** Every point's chunk as MariaDB computes it from point_index, against the compute order's. */
  const expectChunksAgree = async (spec: StoredScanSpec) => {
    const total = pointCount(spec);
    const size = chunkSize(total, spec.method);
    const rows: { i: string; chunk: string }[] = await t.db.query(
      `SELECT point_index AS i, ${chunkOfPointSql(spec, total, spec.method)} AS chunk FROM (SELECT seq AS point_index FROM seq_0_to_${total - 1}) p ORDER BY point_index`,
    );
    const order = computeOrder(spec);
    expect(rows.map((r) => Number(r.chunk))).toEqual(rows.map((r) => Math.floor(order.positionOf(Number(r.i)) / size)));
    return { order, size };
  };

  it('names N_* and the scale parameter as shared axes, and puts them fastest whatever their place', async () => {
    // φ^p: λ only scales V (the family says so), p changes the shape.
    const scan = await submitted('N_* and λ around p', [range('nStar', 50, 60, 30), range('p', 1, 3, 20), range('lambda', 1e-11, 1e-9, 7)]);
    expect(scan.spec.sharedBackgroundAxes).toEqual(['nStar', 'lambda']);
    const { order } = await expectChunksAgree(scan.spec);
    expect(order.identity).toBe(false);
    // The 30 × 7 = 210 points of each p (one background) are computed one after the other.
    const pOf = (position: number) => Math.floor(order.pointAt(position) / 7) % 20;
    const runs = Array.from({ length: 4200 }, (_, k) => pOf(k));
    expect(runs).toEqual(Array.from({ length: 4200 }, (_, k) => Math.floor(k / 210)));
  });

  it('finds the scale parameter of a group model\'s expression too', async () => {
    const agent = await t.signIn(DEMO.plateauMember);
    const model = await agent.post('/api/models').send({
      groupId: plateauId, name: 'compute order: scaled plateau', expression: 'A^2 * (1 - exp(-sqrt(2/3) * phi))^2 * (1 + b * phi / 1000)',
      parameters: [{ name: 'b', defaultValue: 1 }, { name: 'A', defaultValue: 1e-5 }], phiInit: 6, description: '',
    });
    expect(model.status).toBe(201);
    const scan = await submitted('A of an expression', [range('A', 1e-6, 1e-4, 5), range('b', 1, 2, 4)], { kind: 'group', modelId: model.body.id });
    // A multiplies V as A²; b changes its shape.
    expect(scan.spec.sharedBackgroundAxes).toEqual(['A']);
    expect((await expectChunksAgree(scan.spec)).order.identity).toBe(false);
    await t.db.query('DELETE FROM potential_models WHERE id = ?', [model.body.id]);
  });

  it('keeps the index order when the shared axes are already last, and names none for a grid without them', async () => {
    const last = await submitted('N_* last', [range('p', 1, 3, 20), range('nStar', 50, 60, 30)]);
    expect(last.spec.sharedBackgroundAxes).toEqual(['nStar']);
    expect((await expectChunksAgree(last.spec)).order.identity).toBe(true);
    const none = await submitted('p only', [range('p', 1, 3, 50)]);
    expect(none.spec.sharedBackgroundAxes).toEqual([]);
  });
});
