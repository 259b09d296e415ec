import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { parse } from 'csv-parse/sync';
import { createHash } from 'node:crypto';
import { Readable } from 'node:stream';
import { gunzipSync } from 'node:zlib';
import { extract } from 'tar-stream';
import type request from 'supertest';
import { In } from 'typeorm';
import type { QueryDeepPartialEntity } from 'typeorm/query-builder/QueryPartialEntity';
import { AuditEvent } from '../src/audit/entities/audit-event.entity';
import { Group } from '../src/groups/entities/group.entity';
import { ScanArchive } from '../src/maintenance/entities/scan-archive.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { ScanPoint } from '../src/scans/entities/scan-point.entity';
import { ScanTag } from '../src/scans/entities/scan-tag.entity';
import { User } from '../src/users/entities/user.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { storedSpec } from './support/stored-spec';

type Status = Scan['status'];

interface SeedOptions {
  groupId: number;
  ownerId: number;
  name: string;
  tag: string;
  status?: Status;
  /** Days since the scan finished (and was created); null leaves it unfinished. */
  ageDays?: number;
  finished?: boolean;
  points?: number;
}

/** Collects a binary response body as one Buffer. */
// supertest's parser type names its Response; at run time it is the response stream.
function binary(res: request.Response, done: (err: Error | null, body: Buffer) => void): void {
  const stream = res as unknown as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => done(null, Buffer.concat(chunks)));
}

/** Every entry of a .tar.gz, by name. */
async function untar(gz: Buffer): Promise<Map<string, Buffer>> {
  const files = new Map<string, Buffer>();
  const ex = extract();
  const finished = new Promise<void>((resolve, reject) => {
    ex.on('entry', (header, stream, next) => {
      const chunks: Buffer[] = [];
      stream.on('data', (c) => chunks.push(c as Buffer));
      stream.on('end', () => { files.set(header.name, Buffer.concat(chunks)); next(); });
      stream.resume();
    });
    ex.on('finish', resolve);
    ex.on('error', reject);
  });
  Readable.from([gunzipSync(gz)]).pipe(ex);
  await finished;
  return files;
}

describe('storage, pruning, archives and retention', () => {
  let t: TestApp;
  let plateauId: number;
  let tensorId: number;
  let leadId: number;
  let memberId: number;
  let tensorLeadId: number;

  beforeAll(async () => {
    t = await createTestApp();
    const groups = t.db.getRepository(Group);
    plateauId = (await groups.findOneByOrFail({ slug: 'plateau-models' })).id;
    tensorId = (await groups.findOneByOrFail({ slug: 'tensor-modes' })).id;
    const users = t.db.getRepository(User);
    leadId = (await users.findOneByOrFail({ email: DEMO.plateauLead })).id;
    memberId = (await users.findOneByOrFail({ email: DEMO.plateauMember })).id;
    tensorLeadId = (await users.findOneByOrFail({ email: DEMO.tensorLead })).id;
  });
  afterAll(async () => {
    await t.close();
  });

  /** A scan with stored points, inserted directly; its times are set `ageDays` into the past. */
  async function seedScan(o: SeedOptions): Promise<number> {
    const status = o.status ?? 'completed';
    const points = o.points ?? 4;
    const scan = await t.db.getRepository(Scan).save({
      groupId: o.groupId, ownerId: o.ownerId, name: o.name, method: 'slowroll', status, note: `seeded for ${o.tag}`,
      spec: storedSpec(o.groupId, { name: o.name, model: { kind: 'family', family: 'starobinsky' }, potentialSource: 'starobinsky', axes: [{ kind: 'list', parameter: 'nStar', values: [50, 55, 60] }] }),
      totalPoints: points, donePoints: points, failedPoints: points > 0 ? 1 : 0,
    });
    await t.db.getRepository(ScanTag).save({ scanId: scan.id, tag: o.tag });
    const rows: QueryDeepPartialEntity<ScanPoint>[] = [];
    for (let i = 0; i < points; i++) {
      const failed = i === points - 1;
      rows.push({
        scanId: scan.id, pointIndex: i, inputs: { nStar: 50 + i * 0.5, alpha: 1 / (i + 3) },
        status: failed ? 'no_end' : 'ok', failureReason: failed ? 'inflation does not end, "φ" never reaches ε = 1' : null,
        ns: failed ? null : 0.9651 + i / 7e5, r: failed ? null : 0.0033 * Math.SQRT2 / (i + 1), alphaS: failed ? null : -6.1e-4 - i * 1e-7,
        As: failed ? null : 2.1e-9, amplitudeScale: failed ? null : 1.3e-5, nTotal: failed ? null : 63.25 + i, nStar: 50 + i * 0.5,
        phiStar: failed ? null : 5.4 + Math.PI * 1e-3 * i, phiEnd: failed ? null : 0.94, energyScaleGeV: failed ? null : 7.7e15,
        computedAt: new Date(Date.UTC(2026, 10, 1, 9, 30, 0, 123 + i)),
      });
    }
    if (rows.length) await t.db.getRepository(ScanPoint).insert(rows);
    const age = o.ageDays ?? 0;
    const finished = o.finished ?? !['queued', 'running', 'draft'].includes(status);
    await t.db.query(
      `UPDATE scans SET created_at = NOW(3) - INTERVAL ? DAY, finished_at = ${finished ? 'NOW(3) - INTERVAL ? DAY' : 'NULL'} WHERE id = ?`,
      finished ? [age + 1, age, scan.id] : [age, scan.id],
    );
    return scan.id;
  }

  const existing = async (ids: number[]) => (await t.db.getRepository(Scan).findBy({ id: In(ids) })).map((s) => s.id).sort((a, b) => a - b);
  const pointCount = async (ids: number[]) => t.db.getRepository(ScanPoint).countBy({ scanId: In(ids) });
  const deleteEvents = async (ids: number[]) =>
    t.db.getRepository(AuditEvent).find({ where: { action: 'scan.delete', targetType: 'scan', targetId: In(ids.map(String)) }, order: { id: 'ASC' } });

  it("the dry run lists exactly what the real prune then removes, with each scan's points and share of bytes", async () => {
    const tag = 'prune-exact';
    const old = [
      await seedScan({ groupId: plateauId, ownerId: memberId, name: 'old completed', tag, ageDays: 40, points: 6 }),
      await seedScan({ groupId: plateauId, ownerId: leadId, name: 'old failed', tag, status: 'failed', ageDays: 35, points: 3 }),
      await seedScan({ groupId: plateauId, ownerId: memberId, name: 'old cancelled', tag, status: 'cancelled', ageDays: 31, points: 0 }),
    ];
    const young = await seedScan({ groupId: plateauId, ownerId: memberId, name: 'young completed', tag, ageDays: 5 });
    const otherGroup = await seedScan({ groupId: tensorId, ownerId: tensorLeadId, name: 'tensor old', tag, ageDays: 50 });
    const untagged = await seedScan({ groupId: plateauId, ownerId: memberId, name: 'old untagged', tag: 'keep-me', ageDays: 50 });

    const lead = await t.signIn(DEMO.plateauLead);
    const filter = { groupId: plateauId, tag, olderThanDays: 30, statuses: ['completed', 'failed', 'cancelled'] };
    const plan = await lead.post('/api/maintenance/prune/dry-run').send(filter);
    expect(plan.status).toBe(200);
    const planned = (plan.body.items as { scanId: number }[]).map((i) => i.scanId);
    expect(planned).toEqual(old);
    expect(plan.body.items.map((i: { points: number }) => i.points)).toEqual([6, 3, 0]);
    expect(plan.body.items[0]).toMatchObject({ name: 'old completed', groupId: plateauId, ownerId: memberId, status: 'completed' });
    expect(plan.body.items[0].bytes).toBeGreaterThan(0);
    expect(plan.body.items[2].bytes).toBe(0);
    expect(plan.body.totalPoints).toBe(9);

    // A dry run deletes nothing.
    expect(await existing(old)).toEqual(old);

    const pruned = await lead.post('/api/maintenance/prune').send({ ...filter, scanIds: planned });
    expect(pruned.status).toBe(200);
    expect(pruned.body.deleted.map((d: { scanId: number }) => d.scanId)).toEqual(planned);
    expect(pruned.body.deleted.map((d: { points: number }) => d.points)).toEqual([6, 3, 0]);

    expect(await existing(old)).toEqual([]);
    expect(await pointCount(old)).toBe(0);
    expect(await existing([young, otherGroup, untagged])).toEqual([young, otherGroup, untagged].sort((a, b) => a - b));

    // One archive and one audit event per deleted scan.
    const archives = await t.db.getRepository(ScanArchive).findBy({ scanId: In(old) });
    expect(archives.map((a) => a.scanId).sort((a, b) => a - b)).toEqual(old);
    expect(archives.every((a) => a.createdById === leadId)).toBe(true);
    const events = await deleteEvents(old);
    expect(events.map((e) => Number(e.targetId))).toEqual(old);
    for (const [i, e] of events.entries()) {
      expect(e).toMatchObject({ actorId: leadId, groupId: plateauId });
      expect(e.details).toMatchObject({ reason: 'prune', archiveId: pruned.body.deleted[i].archiveId, points: pruned.body.deleted[i].points, archivedPoints: pruned.body.deleted[i].points });
    }

    // The same filter now selects nothing.
    const again = await lead.post('/api/maintenance/prune/dry-run').send(filter);
    expect(again.body.items).toEqual([]);
  });

  it('refuses with 409 and deletes nothing when the selection changed since the dry run', async () => {
    const tag = 'prune-stale';
    const first = [
      await seedScan({ groupId: plateauId, ownerId: memberId, name: 'stale one', tag, ageDays: 20 }),
      await seedScan({ groupId: plateauId, ownerId: memberId, name: 'stale two', tag, ageDays: 21 }),
    ];
    const admin = await t.signIn(DEMO.admin);
    const filter = { tag, olderThanDays: 10 };
    const plan = await admin.post('/api/maintenance/prune/dry-run').send(filter);
    expect(plan.body.items.map((i: { scanId: number }) => i.scanId)).toEqual(first);

    const late = await seedScan({ groupId: tensorId, ownerId: tensorLeadId, name: 'arrived after the dry run', tag, ageDays: 30 });
    const refused = await admin.post('/api/maintenance/prune').send({ ...filter, scanIds: first });
    expect(refused.status).toBe(409);
    expect(refused.body.message).toContain(`also selects scan ${late}`);
    expect(refused.body.fieldErrors).toEqual({ unseen: [String(late)] });

    // An id the filter does not select is refused as well.
    const wider = await admin.post('/api/maintenance/prune').send({ ...filter, scanIds: [...first, late, 999_999] });
    expect(wider.status).toBe(409);
    expect(wider.body.fieldErrors).toEqual({ gone: ['999999'] });

    const all = [...first, late];
    expect(await existing(all)).toEqual(all);
    expect(await pointCount(all)).toBe(12);
    expect(await t.db.getRepository(ScanArchive).countBy({ scanId: In(all) })).toBe(0);
    expect(await deleteEvents(all)).toEqual([]);
  });

  it('never selects or prunes a queued or running scan', async () => {
    const tag = 'prune-live';
    const queued = await seedScan({ groupId: plateauId, ownerId: memberId, name: 'old queued', tag, status: 'queued', ageDays: 90 });
    const running = await seedScan({ groupId: plateauId, ownerId: memberId, name: 'old running', tag, status: 'running', ageDays: 90 });
    const draft = await seedScan({ groupId: plateauId, ownerId: memberId, name: 'old draft', tag, status: 'draft', ageDays: 90, points: 0 });
    const lead = await t.signIn(DEMO.plateauLead);

    const asked = await lead.post('/api/maintenance/prune/dry-run').send({ groupId: plateauId, tag, statuses: ['running', 'queued'] });
    expect(asked.status).toBe(400);

    const filter = { groupId: plateauId, tag, olderThanDays: 30, ageBasis: 'created', statuses: ['draft', 'completed', 'failed', 'cancelled'] };
    const plan = await lead.post('/api/maintenance/prune/dry-run').send(filter);
    expect(plan.status).toBe(200);
    expect(plan.body.items.map((i: { scanId: number }) => i.scanId)).toEqual([draft]);
    const pruned = await lead.post('/api/maintenance/prune').send({ ...filter, scanIds: [draft] });
    expect(pruned.status).toBe(200);
    expect(await existing([queued, running, draft])).toEqual([queued, running]);
    expect(await pointCount([queued, running])).toBe(8);
  });

  it('archives a scan before deleting it: the download un-tars to its specification and exactly its stored points', async () => {
    const tag = 'archive-readback';
    const id = await seedScan({ groupId: plateauId, ownerId: memberId, name: 'archived, 25 points', tag, ageDays: 12, points: 25 });
    const storedScan = await t.db.getRepository(Scan).findOneByOrFail({ id });
    const storedPoints = await t.db.getRepository(ScanPoint).find({ where: { scanId: id }, order: { pointIndex: 'ASC' } });
    expect(storedPoints).toHaveLength(25);

    const admin = await t.signIn(DEMO.admin);
    const filter = { tag };
    const plan = await admin.post('/api/maintenance/prune/dry-run').send(filter);
    const pruned = await admin.post('/api/maintenance/prune').send({ ...filter, scanIds: plan.body.items.map((i: { scanId: number }) => i.scanId) });
    expect(pruned.body.deleted).toHaveLength(1);
    const { archiveId } = pruned.body.deleted[0];

    // The group's lead finds it in the list and downloads it; a member may not.
    const lead = await t.signIn(DEMO.plateauLead);
    const list = await lead.get(`/api/maintenance/archives?groupId=${plateauId}`);
    expect(list.status).toBe(200);
    const listed = list.body.find((a: { id: number }) => a.id === archiveId);
    expect(listed).toMatchObject({ scanId: id, scanName: 'archived, 25 points', groupId: plateauId, points: 25, createdByName: expect.any(String) });
    const member = await t.signIn(DEMO.plateauMember);
    expect((await member.get(`/api/maintenance/archives/${archiveId}/download`)).status).toBe(403);
    const tensorLead = await t.signIn(DEMO.tensorLead);
    expect((await tensorLead.get(`/api/maintenance/archives/${archiveId}/download`)).status).toBe(404);

    const download = await lead.get(`/api/maintenance/archives/${archiveId}/download`).buffer(true).parse(binary);
    expect(download.status).toBe(200);
    expect(download.headers['content-type']).toContain('application/gzip');
    const body = download.body as Buffer;
    expect(body.length).toBe(listed.bytes);
    expect(createHash('sha256').update(body).digest('hex')).toBe(listed.sha256);

    const files = await untar(body);
    expect([...files.keys()].sort()).toEqual(['points.csv', 'scan.json']);
    const record = JSON.parse(files.get('scan.json')!.toString('utf8'));
    expect(record).toMatchObject({ id, name: 'archived, 25 points', groupId: plateauId, ownerId: memberId, status: 'completed', tags: [tag], storedPoints: 25 });
    expect(record.spec).toEqual(storedScan.spec);
    expect(record.finishedAt).toBe(storedScan.finishedAt!.toISOString());
    // Stored without provenance (as scans before it was recorded): the archive says so, inventing nothing.
    expect(record.provenance).toEqual({ scanId: id, recorded: null, runsRecorded: false, workers: [], runs: [] });

    const rows: Record<string, string>[] = parse(files.get('points.csv')!, { columns: true });
    expect(rows).toHaveLength(storedPoints.length);
    const num = (v: string) => (v === '' ? null : Number(v));
    rows.forEach((row, i) => {
      const p = storedPoints[i];
      expect({
        pointIndex: Number(row.point_index), inputs: JSON.parse(row.inputs), status: row.status, failureReason: row.failure_reason || null,
        ns: num(row.ns), r: num(row.r), alphaS: num(row.alpha_s), As: num(row.a_s), amplitudeScale: num(row.amplitude_scale),
        nTotal: num(row.n_total), nStar: num(row.n_star), phiStar: num(row.phi_star), phiEnd: num(row.phi_end),
        energyScaleGeV: num(row.energy_scale_gev), computedAt: row.computed_at,
      }).toEqual({
        pointIndex: p.pointIndex, inputs: p.inputs, status: p.status, failureReason: p.failureReason, ns: p.ns, r: p.r, alphaS: p.alphaS,
        As: p.As, amplitudeScale: p.amplitudeScale, nTotal: p.nTotal, nStar: p.nStar, phiStar: p.phiStar, phiEnd: p.phiEnd,
        energyScaleGeV: p.energyScaleGeV, computedAt: p.computedAt.toISOString(),
      });
    });
    expect(rows[24].failure_reason).toBe('inflation does not end, "φ" never reaches ε = 1');
  });

  it('archives a single delete too, and records it with its archive', async () => {
    const id = await seedScan({ groupId: plateauId, ownerId: memberId, name: 'deleted by hand', tag: 'single-delete', points: 5 });
    const lead = await t.signIn(DEMO.plateauLead);
    const res = await lead.delete(`/api/scans/${id}`).send({});
    expect(res.status).toBe(204);
    expect(await existing([id])).toEqual([]);
    expect(await pointCount([id])).toBe(0);
    const archive = await t.db.getRepository(ScanArchive).findOneByOrFail({ scanId: id });
    expect(archive).toMatchObject({ points: 5, groupId: plateauId, createdById: leadId, scanName: 'deleted by hand' });
    const [event] = await deleteEvents([id]);
    expect(event).toMatchObject({ actorId: leadId, groupId: plateauId });
    expect(event.details).toMatchObject({ reason: 'manual', archiveId: archive.id, points: 5 });
  });

  it('retention: a lead sets the policy (on record), the run prunes by it with no actor, and the nightly job is registered', async () => {
    const tag = 'retention';
    const expired = await seedScan({ groupId: tensorId, ownerId: tensorLeadId, name: 'tensor expired', tag, ageDays: 45 });
    const failedOld = await seedScan({ groupId: tensorId, ownerId: tensorLeadId, name: 'tensor failed old', tag, status: 'failed', ageDays: 45 });
    const recent = await seedScan({ groupId: tensorId, ownerId: tensorLeadId, name: 'tensor recent', tag, ageDays: 10 });
    const plateauOld = await seedScan({ groupId: plateauId, ownerId: memberId, name: 'plateau old, no policy', tag, ageDays: 400 });

    const tensorLead = await t.signIn(DEMO.tensorLead);
    const set = await tensorLead.patch(`/api/maintenance/groups/${tensorId}/retention`).send({ keepDays: 30, statuses: ['completed'] });
    expect(set.status).toBe(200);
    expect(set.body).toEqual({ keepDays: 30, statuses: ['completed'] });
    expect((await tensorLead.get(`/api/maintenance/groups/${tensorId}/retention`)).body).toEqual({ keepDays: 30, statuses: ['completed'] });
    const change = await t.db.getRepository(AuditEvent).findOneOrFail({ where: { action: 'group.retention_change', groupId: tensorId }, order: { id: 'DESC' } });
    expect(change).toMatchObject({ actorId: tensorLeadId, targetType: 'group', targetId: String(tensorId) });
    expect(change.details).toMatchObject({ before: { keepDays: null }, after: { keepDays: 30, statuses: ['completed'] } });

    // What the policy selects now, computed independently of the service.
    const due: { id: number }[] = await t.db.query(
      `SELECT id FROM scans WHERE group_id = ? AND status = 'completed' AND COALESCE(finished_at, created_at) < NOW(3) - INTERVAL 30 DAY ORDER BY id`,
      [tensorId],
    );
    // Earlier tests left older completed Tensor Modes scans too; the run must take exactly these.
    const dueIds = due.map((r) => Number(r.id));
    expect(dueIds).toContain(expired);
    expect(dueIds).not.toContain(failedOld);
    expect(dueIds).not.toContain(recent);

    const admin = await t.signIn(DEMO.admin);
    expect((await tensorLead.post('/api/maintenance/retention/run').send({})).status).toBe(403);
    const run = await admin.post('/api/maintenance/retention/run').send({});
    expect(run.status).toBe(200);
    expect(run.body.groups).toEqual([{ groupId: tensorId, deleted: dueIds.length }]);
    expect(await existing(dueIds)).toEqual([]);
    expect(await existing([failedOld, recent, plateauOld])).toEqual([failedOld, recent, plateauOld]);
    expect((await deleteEvents(dueIds)).map((e) => Number(e.targetId))).toEqual(dueIds);

    const [event] = await deleteEvents([expired]);
    expect(event).toMatchObject({ actorId: null, groupId: tensorId });
    expect(event.details).toMatchObject({ reason: 'retention', points: 4 });
    expect(await t.db.getRepository(ScanArchive).findOneByOrFail({ scanId: expired })).toMatchObject({ createdById: null, points: 4 });
    // What the nightly job deleted, as a maintainer finds it: the deletions nobody made by hand.
    const unattended = await admin.get('/api/admin/audit-events').query({ action: 'scan.delete', actorId: 'none', groupId: tensorId, pageSize: 200 });
    expect(unattended.status).toBe(200);
    expect(unattended.body.items.map((e: { targetId: string }) => Number(e.targetId)).sort((a: number, b: number) => a - b)).toEqual([...dueIds].sort((a, b) => a - b));
    expect(unattended.body.items.every((e: { actorId: number | null }) => e.actorId === null)).toBe(true);

    // The nightly job: registered at boot with the configured time.
    const storage = await admin.get('/api/maintenance/storage');
    expect(storage.body.retention.cron).toBe('30 3 * * *');
    expect(Date.parse(storage.body.retention.nextRunAt)).toBeGreaterThan(Date.now());

    await tensorLead.patch(`/api/maintenance/groups/${tensorId}/retention`).send({ keepDays: null, statuses: ['completed'] });
  });

  it("reports storage from MariaDB's figures: per table, per group and per scan as the scan's share", async () => {
    const id = await seedScan({ groupId: tensorId, ownerId: tensorLeadId, name: 'storage sample', tag: 'storage', points: 7 });
    const lead = await t.signIn(DEMO.tensorLead);
    const res = await lead.get('/api/maintenance/storage');
    expect(res.status).toBe(200);
    const points = res.body.tables.find((tb: { table: string }) => tb.table === 'scan_points');
    expect(points.dataBytes).toBeGreaterThan(0);
    expect(res.body.bytesPerPoint).toBeGreaterThan(0);
    // A lead sees only the groups they lead.
    expect(res.body.groups.map((g: { groupId: number }) => g.groupId)).toEqual([tensorId]);
    const sample = res.body.scans.find((s: { scanId: number }) => s.scanId === id);
    expect(sample).toMatchObject({ points: 7, groupId: tensorId, bytes: Math.round(7 * res.body.bytesPerPoint) });
    expect(res.body.scans.every((s: { groupId: number }) => s.groupId === tensorId)).toBe(true);
    const [{ n }] = await t.db.query('SELECT COUNT(*) AS n FROM scan_points p JOIN scans s ON s.id = p.scan_id WHERE s.group_id = ?', [tensorId]);
    expect(res.body.groups[0].points).toBe(Number(n));
  });

  it('filters the audit log by action, actor, group, target type and dates', async () => {
    const admin = await t.signIn(DEMO.admin);
    const today = new Date().toISOString().slice(0, 10);
    const res = await admin.get('/api/admin/audit-events').query({ action: 'scan.delete', actorId: leadId, groupId: plateauId, targetType: 'scan', from: today, to: today, pageSize: 200 });
    expect(res.status).toBe(200);
    const expected = await t.db.getRepository(AuditEvent).countBy({ action: 'scan.delete', actorId: leadId, groupId: plateauId, targetType: 'scan' });
    expect(res.body.total).toBe(expected);
    expect(expected).toBeGreaterThanOrEqual(5);
    expect(res.body.items.every((e: { action: string; actorId: number }) => e.action === 'scan.delete' && e.actorId === leadId)).toBe(true);
    const yesterday = new Date(Date.now() - 86_400_000).toISOString().slice(0, 10);
    const before = await admin.get('/api/admin/audit-events').query({ action: 'scan.delete', to: yesterday });
    expect(before.body.total).toBe(0);
    expect((await admin.get('/api/admin/audit-events').query({ from: 'yesterday' })).status).toBe(400);
    // Actions and target types come from one shared list, so a misspelt filter is refused rather than matching nothing.
    const misspelt = await admin.get('/api/admin/audit-events').query({ action: 'scan.deleted', targetType: 'scans' });
    expect(misspelt.status).toBe(400);
    expect(Object.keys(misspelt.body.fieldErrors).sort()).toEqual(['action', 'targetType']);
  });
});
