import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import type { ChildProcess } from 'node:child_process';
import { Like } from 'typeorm';
import { confidenceOf, RegionLikelihood, SIGMA_CONFIDENCE_LEVELS, type ConstraintRegion as RegionDto, type RegionVertex, type ScanPointDto } from '@sixtyfold/shared';
import { ConstraintRegion } from '../src/constraint-regions/entities/constraint-region.entity';
import { Group } from '../src/groups/entities/group.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { until } from './support/until';
import { startWorkers, stopWorkers } from './support/workers';

// A group's uploaded 68 % and 95 % contours used as a likelihood: a real grid scan judged per point
// by `RegionLikelihood` on the points page, in exports, constraints and evidence. The contours are
// circles around the mean of the scan's (n_s, r), the inner one through a stored point, which then
// has Δχ² = t₁ = −2 ln(1 − 0.6827) = 2.2957 exactly (the χ² quantile in two parameters, closed form).

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
// Every scan and region this file makes is named so, and removed at the end.
const PREFIX = 'e2e region likelihood';
const UPLOAD_HEADER = ['X-Sixtyfold-Request', 'upload'] as const;
const [LEVEL_68, LEVEL_95] = SIGMA_CONFIDENCE_LEVELS;
const NOT_IN_SQL = 'needs a published or admin likelihood set: a region likelihood is evaluated per point outside the database';

// λφ^p from φ_init = 16: about 127 e-folds for p = 1 and 63 for p = 2, so every N_* from 50 to 60 ends.
const AXES = [
  { kind: 'list', parameter: 'p', values: [1, 2] },
  { kind: 'range', parameter: 'nStar', min: 50, max: 60, count: 4, spacing: 'linear' },
];

/** A circle of 64 vertices around `centre`; with `through`, the first vertex is that point exactly, as stored. */
function circle(centre: RegionVertex, radius: number, through?: RegionVertex): RegionVertex[] {
  const start = through ? Math.atan2(through.r - centre.r, through.ns - centre.ns) : 0;
  return Array.from({ length: 64 }, (_, k) => {
    const angle = start + (2 * Math.PI * k) / 64;
    return k === 0 && through ? through : { ns: centre.ns + radius * Math.cos(angle), r: centre.r + radius * Math.sin(angle) };
  });
}

describe('uploaded constraint regions as a likelihood', () => {
  let t: TestApp;
  let member: Agent;
  let workers: ChildProcess[] = [];
  let scanId: number;
  let okPoints: ScanPointDto[];
  let inner: RegionDto;
  let outer: RegionDto;
  /** The point the 68 % circle runs through, and the farthest from the centre (outside the 95 % circle). */
  let onContour: ScanPointDto;
  let farthest: ScanPointDto;
  let expected: RegionLikelihood;
  let ref: string;

  async function uploadRegion(agent: Agent, groupId: number, name: string, level: number, vertices: RegionVertex[]) {
    const res = await agent
      .post('/api/constraint-regions')
      .set(...UPLOAD_HEADER)
      .field('groupId', String(groupId))
      .field('name', `${PREFIX}: ${name}`)
      .field('source', 'Invented survey, data release 3')
      .field('confidenceLevel', String(level))
      .attach('file', Buffer.from(`n_s,r\n${vertices.map((v) => `${v.ns},${v.r}`).join('\n')}\n`), { filename: 'region.csv', contentType: 'text/csv' });
    if (res.status !== 201) throw new Error(`POST /api/constraint-regions answered ${res.status}: ${JSON.stringify(res.body)}`);
    return res.body as RegionDto;
  }

  beforeAll(async () => {
    t = await createTestApp();
    const plateauId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    member = await t.signIn(DEMO.plateauMember);
    const created = await member.post('/api/scans').send({
      groupId: plateauId, name: `${PREFIX}: monomials`, model: { kind: 'family', family: 'monomial' }, phiInit: 16,
      axes: AXES, pivot: { kind: 'fixed' }, method: 'slowroll',
    });
    if (created.status !== 201) throw new Error(`POST /api/scans answered ${created.status}: ${JSON.stringify(created.body)}`);
    scanId = created.body.id;
    workers = startWorkers(1);
    await until(async () => ((await member.get(`/api/scans/${scanId}`)).body.status === 'completed' ? true : undefined), 'the scan to complete');
    okPoints = (await member.get(`/api/scans/${scanId}/points?status=ok&pageSize=1000`)).body.items;

    // Circles around the mean (n_s, r): the 68 % one through the nearest point, the 95 % one halfway to the farthest.
    const centre = { ns: okPoints.reduce((s, p) => s + p.ns!, 0) / okPoints.length, r: okPoints.reduce((s, p) => s + p.r!, 0) / okPoints.length };
    const distance = (p: ScanPointDto) => Math.hypot(p.ns! - centre.ns, p.r! - centre.r);
    const byDistance = [...okPoints].sort((a, b) => distance(a) - distance(b));
    [onContour, farthest] = [byDistance[0], byDistance.at(-1)!];
    const innerVertices = circle(centre, distance(onContour), { ns: onContour.ns!, r: onContour.r! });
    const outerVertices = circle(centre, (distance(onContour) + distance(farthest)) / 2);
    inner = await uploadRegion(member, plateauId, '68 %', LEVEL_68, innerVertices);
    outer = await uploadRegion(member, plateauId, '95 %', LEVEL_95, outerVertices);
    // As stored and read back, which is what the API judges with.
    expected = new RegionLikelihood([inner, outer]);
    ref = `regions:${inner.id},${outer.id}`;
  }, 180_000);
  afterAll(async () => {
    await stopWorkers(workers);
    await t.db.getRepository(Scan).delete({ name: Like(`${PREFIX}%`) });
    await t.db.getRepository(ConstraintRegion).delete({ name: Like(`${PREFIX}%`) });
    await t.close();
  });

  it('stores circles with r ≥ 0, and a real scan with OK points on, between and outside the contours', () => {
    expect(okPoints.length).toBe(8);
    for (const region of [inner, outer]) expect(Math.min(...region.vertices.map((v) => v.r))).toBeGreaterThanOrEqual(0);
    expect(inner.vertices[0]).toEqual({ ns: onContour.ns, r: onContour.r });
    // On the 68 % contour, between the contours, and outside the 95 % one.
    expect(new Set(okPoints.map((p) => expected.at({ ns: p.ns!, r: p.r! }).insideLevel))).toEqual(new Set([LEVEL_68, LEVEL_95, null]));
  });

  it('gives each point its Δχ² from RegionLikelihood at its stored (n_s, r), the 2-parameter confidence, and flags points outside', async () => {
    const res = await member.get(`/api/scans/${scanId}/points?likelihood=${ref}&pageSize=1000`);
    expect(res.status).toBe(200);
    expect(res.body.items).toHaveLength(okPoints.length);
    for (const point of res.body.items as ScanPointDto[]) {
      const want = expected.at({ ns: point.ns!, r: point.r! });
      expect(point.deltaChi2).toBeCloseTo(want.deltaChi2, 12);
      expect(point.confidence).toBeCloseTo(confidenceOf(want.deltaChi2, 2), 12);
      expect(point.outsideRegions).toBe(want.outside);
    }
    const judged = (p: ScanPointDto) => (res.body.items as ScanPointDto[]).find((q) => q.pointIndex === p.pointIndex)!;
    // On the 68.27 % contour: Δχ² = −2 ln(1 − 0.6827) = 2.2957 and the confidence is the contour's level.
    expect(judged(onContour).deltaChi2).toBeCloseTo(-2 * Math.log(1 - LEVEL_68), 9);
    expect(judged(onContour).deltaChi2).toBeCloseTo(2.2957, 4);
    expect(judged(onContour).confidence).toBeCloseTo(LEVEL_68, 9);
    expect(judged(farthest)).toMatchObject({ outsideRegions: true });
    expect(judged(farthest).deltaChi2).toBeGreaterThan(-2 * Math.log(1 - LEVEL_95));
    // A viewer of the group may use the group's regions too.
    const viewer = await t.signIn(DEMO.plateauViewer);
    expect((await viewer.get(`/api/scans/${scanId}/points?likelihood=${ref}&pageSize=1`)).status).toBe(200);
  });

  it('names the regions in the constraints and the evidence, judged the same way', async () => {
    const res = await member.get(`/api/scans/${scanId}/constraints?likelihood=${ref}`);
    expect(res.status).toBe(200);
    expect(res.body.likelihood).toEqual({
      kind: 'regions',
      ref,
      name: `Uploaded regions: ${PREFIX}: 68 % (68.27%), ${PREFIX}: 95 % (95.45%)`,
      statement: expect.stringMatching(/interpolated .* extrapolated/),
      regions: [inner, outer].map(({ id, name, source, confidenceLevel }) => ({ id, name, source, confidenceLevel })),
    });
    const best = okPoints.reduce((a, b) => (expected.at({ ns: a.ns!, r: a.r! }).deltaChi2 <= expected.at({ ns: b.ns!, r: b.r! }).deltaChi2 ? a : b));
    expect(res.body.bestFit).toMatchObject({ pointIndex: best.pointIndex, deltaChi2: expect.closeTo(expected.at({ ns: best.ns!, r: best.r! }).deltaChi2, 12) });
    expect(res.body.included).toBe(okPoints.length);

    const csv = await member.get(`/api/scans/${scanId}/constraints?likelihood=${ref}&format=csv`);
    expect(csv.headers['content-disposition']).toBe(`attachment; filename="scan-${scanId}-marginals-regions-${inner.id}-${outer.id}.csv"`);

    const evidence = await member.get(`/api/scans/evidence?ids=${scanId}&likelihoods=planck18-bk18,${ref}`);
    expect(evidence.status).toBe(200);
    expect(evidence.body.sets.map((set: { likelihood: { kind: string; ref: string } }) => [set.likelihood.kind, set.likelihood.ref])).toEqual([['set', 'planck18-bk18@1'], ['regions', ref]]);
    expect(evidence.body.sets[1].scans[0]).toMatchObject({ scanId, included: okPoints.length, rank: 1 });
  });

  it('carries Δχ² and the confidence level in the exports, streamed', async () => {
    const csv = await member.get(`/api/scans/${scanId}/points?format=csv&likelihood=${ref}`);
    expect(csv.status).toBe(200);
    const [header, ...lines] = csv.text.trim().split('\n').filter((l) => !l.startsWith('#'));
    const names = header.split(',');
    expect(names.slice(-2)).toEqual(['deltaChi2', 'confidence']);
    expect(lines).toHaveLength(okPoints.length);
    for (const line of lines) {
      const cells = line.split(',');
      const want = expected.at({ ns: Number(cells[names.indexOf('ns')]), r: Number(cells[names.indexOf('r')]) });
      expect(cells.at(-2)).toBe(String(want.deltaChi2));
      expect(cells.at(-1)).toBe(String(confidenceOf(want.deltaChi2, 2)));
    }
    const json = await member.get(`/api/scans/${scanId}/points?format=json&likelihood=${ref}`);
    const exported = (json.body as ScanPointDto[]).find((p) => p.pointIndex === onContour.pointIndex)!;
    expect(exported.deltaChi2).toBe(expected.at({ ns: onContour.ns!, r: onContour.r! }).deltaChi2);
  });

  it('refuses Δχ² in SQL (sorting, a bound, a heatmap) under regions, naming why', async () => {
    const sorted = await member.get(`/api/scans/${scanId}/points?likelihood=${ref}&sort=deltaChi2`);
    expect([sorted.status, sorted.body.fieldErrors?.sort]).toEqual([400, [`sorting by deltaChi2 ${NOT_IN_SQL}`]]);
    const bounded = await member.get(`/api/scans/${scanId}/points?likelihood=${ref}&deltaChi2_max=6.18`);
    expect([bounded.status, bounded.body.fieldErrors?.deltaChi2_max]).toEqual([400, [`deltaChi2_max ${NOT_IN_SQL}`]]);
    const heatmap = await member.get(`/api/scans/${scanId}/grid?x=nStar&y=p&output=deltaChi2&likelihood=${ref}`);
    expect([heatmap.status, heatmap.body.fieldErrors?.output]).toEqual([400, [`output=deltaChi2 ${NOT_IN_SQL}`]]);
    // A set still sorts.
    expect((await member.get(`/api/scans/${scanId}/points?likelihood=planck18-bk18&sort=deltaChi2`)).status).toBe(200);
  });

  it('answers 404 for an unknown region or another group\'s, and 400 for contours that do not make a likelihood', async () => {
    const tensorId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'tensor-modes' })).id;
    const tensorMember = await t.signIn(DEMO.tensorMember);
    const theirs = await uploadRegion(tensorMember, tensorId, 'another group', LEVEL_68, inner.vertices);
    for (const url of [`/api/scans/${scanId}/points?likelihood=regions:${inner.id},${theirs.id}`, `/api/scans/${scanId}/constraints?likelihood=regions:${theirs.id}`]) {
      const res = await member.get(url);
      expect([res.status, res.body.message]).toEqual([404, `No such constraint region ${theirs.id}`]);
    }
    // Its own group may use it.
    expect((await tensorMember.get(`/api/constraint-regions?groupId=${tensorId}`)).body.map((r: RegionDto) => r.id)).toContain(theirs.id);
    const unknown = await member.get(`/api/scans/${scanId}/points?likelihood=regions:999999999`);
    expect([unknown.status, unknown.body.message]).toEqual([404, 'No such constraint region 999999999']);

    const plateauId = inner.groupId;
    const twin = await uploadRegion(member, plateauId, 'a second 68 %', LEVEL_68, outer.vertices);
    const sameLevel = await member.get(`/api/scans/${scanId}/constraints?likelihood=regions:${inner.id},${twin.id}`);
    expect([sameLevel.status, sameLevel.body.fieldErrors?.likelihood]).toEqual([400, [`regions:${inner.id},${twin.id}: two contours share the level ${LEVEL_68}`]]);
    // A 95 % contour inside the 68 % one: the inner circle shrunk by half towards its first vertex.
    const shrunk = inner.vertices.map((v) => ({ ns: (v.ns + inner.vertices[0].ns) / 2, r: (v.r + inner.vertices[0].r) / 2 }));
    const small = await uploadRegion(member, plateauId, 'a small 95 %', LEVEL_95, shrunk);
    const notNested = await member.get(`/api/scans/${scanId}/points?likelihood=regions:${inner.id},${small.id}`);
    expect(notNested.status).toBe(400);
    expect(notNested.body.fieldErrors?.likelihood).toEqual([expect.stringContaining('the contours must be nested')]);
    const malformed = await member.get(`/api/scans/${scanId}/points?likelihood=regions:first`);
    expect([malformed.status, malformed.body.fieldErrors?.likelihood]).toEqual([400, ['name uploaded regions by their ids, e.g. regions:12,13']]);
  });
});
