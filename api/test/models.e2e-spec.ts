import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { spawn } from 'node:child_process';
import path from 'node:path';
import { In, Like } from 'typeorm';
import { checkPotentialExpression, type StoredScanSpec } from '@sixtyfold/shared';
import { AuditEvent } from '../src/audit/entities/audit-event.entity';
import { Group } from '../src/groups/entities/group.entity';
import { PotentialModel } from '../src/models/entities/potential-model.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { ScanPoint } from '../src/scans/entities/scan-point.entity';
import { User } from '../src/users/entities/user.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { until } from './support/until';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
const WORKER_MAIN = path.resolve('../worker/dist/main.js');
// Every model this file makes is named so, and removed at the end.
const PREFIX = 'e2e model';

describe('group models: create, edit, delete', () => {
  let t: TestApp;
  let plateauId: number;
  let tensorId: number;
  let member: Agent;
  let lead: Agent;
  let viewer: Agent;
  let outsider: Agent;
  const scansMade: number[] = [];

  const quadratic = (name: string, groupId = plateauId) => ({
    groupId,
    name,
    expression: '0.5 * m^2 * phi^2',
    parameters: [{ name: 'm', defaultValue: 6e-6, min: 1e-7, max: 1e-4, description: 'inflaton mass' }],
    phiInit: 16,
  });

  async function create(agent: Agent, body: Record<string, unknown>) {
    const res = await agent.post('/api/models').send(body);
    if (res.status !== 201) throw new Error(`POST /api/models answered ${res.status}: ${JSON.stringify(res.body)}`);
    return res.body as { id: number; name: string; groupId: number };
  }

  beforeAll(async () => {
    t = await createTestApp();
    plateauId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    tensorId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'tensor-modes' })).id;
    member = await t.signIn(DEMO.plateauMember);
    lead = await t.signIn(DEMO.plateauLead);
    viewer = await t.signIn(DEMO.plateauViewer);
    outsider = await t.signIn(DEMO.tensorMember);
  });
  afterAll(async () => {
    if (scansMade.length) await t.db.getRepository(Scan).delete({ id: In(scansMade) });
    await t.db.getRepository(PotentialModel).delete({ name: Like(`${PREFIX}%`) });
    await t.close();
  });

  it('a member adds a model: 201 with the stored model, its creator and an audit event', async () => {
    const res = await member.post('/api/models').send({ ...quadratic(`  ${PREFIX}: quadratic  `), description: 'm²φ²/2' });
    expect(res.status).toBe(201);
    const lucia = await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauMember });
    expect(res.body).toMatchObject({
      groupId: plateauId,
      name: `${PREFIX}: quadratic`,
      expression: '0.5 * m^2 * phi^2',
      parameters: [{ name: 'm', defaultValue: 6e-6, min: 1e-7, max: 1e-4, description: 'inflaton mass' }],
      phiInit: 16,
      description: 'm²φ²/2',
      createdById: lucia.id,
    });
    const row = await t.db.getRepository(PotentialModel).findOneByOrFail({ id: res.body.id });
    expect(row).toMatchObject({ groupId: plateauId, name: `${PREFIX}: quadratic`, phiInit: 16 });
    const events = await t.db.getRepository(AuditEvent).findBy({ action: 'model.create', targetId: String(res.body.id) });
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({ actorId: lucia.id, groupId: plateauId, targetType: 'model', details: { name: `${PREFIX}: quadratic` } });
    // The list and the single read show it to the group.
    expect(((await viewer.get('/api/models')).body as { id: number }[]).map((m) => m.id)).toContain(res.body.id);
    expect((await viewer.get(`/api/models/${res.body.id}`)).body).toEqual(res.body);
  });

  it('refuses an expression it cannot read with the form\'s message, which says where', async () => {
    const expression = '0.5 * m^2 * sinn(phi)';
    const res = await member.post('/api/models').send({ ...quadratic(`${PREFIX}: typo`), expression });
    expect(res.status).toBe(400);
    const check = checkPotentialExpression(expression, ['m']);
    expect(check.ok).toBe(false);
    expect(res.body.fieldErrors.expression).toEqual([(check as { message: string }).message]);
    expect(res.body.fieldErrors.expression[0]).toMatch(/^at character 13: unsupported function 'sinn'/);
    expect(res.body.message).toMatch(/^expression: at character 13: /);
    expect(await t.db.getRepository(PotentialModel).countBy({ name: `${PREFIX}: typo` })).toBe(0);
  });

  it('refuses bad parameters and a missing φ_init, naming each field', async () => {
    const res = await member.post('/api/models').send({
      groupId: plateauId,
      name: `${PREFIX}: bad parameters`,
      expression: 'm * phi^2',
      parameters: [{ name: 'm', defaultValue: 2, min: 1, max: 1 }, { name: 'm', defaultValue: 1 }, { name: 'phi', defaultValue: 1 }],
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fieldErrors).sort()).toEqual(['parameters.0.defaultValue', 'parameters.0.max', 'parameters.1.name', 'parameters.2.name', 'phiInit']);
    expect(res.body.fieldErrors['parameters.2.name']).toEqual(['phi is the field; give the parameter another name']);
  });

  it('keeps names unique within a group (409), but another group may use the same name', async () => {
    await create(member, quadratic(`${PREFIX}: taken`));
    const clash = await lead.post('/api/models').send(quadratic(`${PREFIX}: taken`));
    expect(clash.status).toBe(409);
    expect(clash.body.message).toBe(`Plateau Models already has a model named "${PREFIX}: taken"; choose another name`);
    expect(await t.db.getRepository(PotentialModel).countBy({ groupId: plateauId, name: `${PREFIX}: taken` })).toBe(1);
    const elsewhere = await outsider.post('/api/models').send(quadratic(`${PREFIX}: taken`, tensorId));
    expect(elsewhere.status).toBe(201);
    expect(elsewhere.body.groupId).toBe(tensorId);
  });

  it('needs the member role in the group: viewers get 403, other groups and unknown groups 404', async () => {
    const asViewer = await viewer.post('/api/models').send(quadratic(`${PREFIX}: by a viewer`));
    expect(asViewer.status).toBe(403);
    expect(asViewer.body.message).toBe('This needs the member role in the group; you are viewer');
    expect((await outsider.post('/api/models').send(quadratic(`${PREFIX}: by an outsider`))).status).toBe(404);
    const admin = await t.signIn(DEMO.admin);
    expect((await admin.post('/api/models').send(quadratic(`${PREFIX}: nowhere`, 999_999))).status).toBe(404);
    expect(await t.db.getRepository(PotentialModel).countBy({ name: Like(`${PREFIX}: by %`) })).toBe(0);
  });

  it('edits the fields given and checks the model that results', async () => {
    const made = await create(member, quadratic(`${PREFIX}: to edit`));
    const renamed = await member.patch(`/api/models/${made.id}`).send({ name: `${PREFIX}: edited `, description: 'now with a note' });
    expect(renamed.status).toBe(200);
    expect(renamed.body).toMatchObject({ id: made.id, name: `${PREFIX}: edited`, description: 'now with a note', expression: '0.5 * m^2 * phi^2', phiInit: 16 });
    expect(await t.db.getRepository(PotentialModel).findOneByOrFail({ id: made.id })).toMatchObject({ name: `${PREFIX}: edited`, description: 'now with a note' });
    const updated = await t.db.getRepository(AuditEvent).findBy({ action: 'model.update', targetId: String(made.id) });
    expect(updated.map((e) => e.details)).toEqual([{ name: `${PREFIX}: edited`, changed: ['name', 'description'] }]);

    // New expression and parameters together.
    const reworked = await member.patch(`/api/models/${made.id}`).send({
      expression: 'lambda * phi^4 / 4',
      parameters: [{ name: 'lambda', defaultValue: 1e-13 }],
      phiInit: 22,
    });
    expect(reworked.status).toBe(200);
    expect(reworked.body).toMatchObject({ expression: 'lambda * phi^4 / 4', parameters: [{ name: 'lambda', defaultValue: 1e-13, description: '' }], phiInit: 22 });

    // The stored expression uses lambda: dropping the parameter alone is refused, at the expression.
    const dropped = await member.patch(`/api/models/${made.id}`).send({ parameters: [] });
    expect(dropped.status).toBe(400);
    expect(dropped.body.fieldErrors.expression).toEqual([(checkPotentialExpression('lambda * phi^4 / 4', []) as { message: string }).message]);
    expect(dropped.body.fieldErrors.expression[0]).toMatch(/^at character 1: unknown symbol 'lambda'/);
    const badExpression = await member.patch(`/api/models/${made.id}`).send({ expression: 'lambda * phi^' });
    expect(badExpression.status).toBe(400);
    expect(badExpression.body.fieldErrors.expression[0]).toMatch(/^at the end of the expression: /);
    expect((await member.patch(`/api/models/${made.id}`).send({ name: '  ' })).status).toBe(400);

    const other = await create(member, quadratic(`${PREFIX}: other`));
    const clash = await member.patch(`/api/models/${other.id}`).send({ name: `${PREFIX}: edited` });
    expect(clash.status).toBe(409);
    expect(await t.db.getRepository(PotentialModel).findOneByOrFail({ id: other.id })).toMatchObject({ name: `${PREFIX}: other` });

    expect((await viewer.patch(`/api/models/${made.id}`).send({ description: 'viewer' })).status).toBe(403);
    expect((await outsider.patch(`/api/models/${made.id}`).send({ description: 'outsider' })).status).toBe(404);
    expect((await member.patch('/api/models/999999').send({ description: 'nobody' })).status).toBe(404);
    expect(await t.db.getRepository(PotentialModel).findOneByOrFail({ id: made.id })).toMatchObject({ description: 'now with a note', phiInit: 22 });
  });

  it('only a lead deletes a model (204), and a scan submitted with it still runs and stays readable', async () => {
    const made = await create(member, quadratic(`${PREFIX}: to delete`));
    const submitted = await member.post('/api/scans').send({
      groupId: plateauId, name: 'scan of a model deleted after submission', model: { kind: 'group', modelId: made.id },
      axes: [{ kind: 'list', parameter: 'nStar', values: [50, 55] }], pivot: { kind: 'fixed' }, method: 'slowroll',
    });
    expect(submitted.status).toBe(201);
    const scanId = submitted.body.id as number;
    scansMade.push(scanId);

    expect((await member.delete(`/api/models/${made.id}`).send({})).status).toBe(403);
    expect((await viewer.delete(`/api/models/${made.id}`).send({})).status).toBe(403);
    expect((await outsider.delete(`/api/models/${made.id}`).send({})).status).toBe(404);
    expect(await t.db.getRepository(PotentialModel).countBy({ id: made.id })).toBe(1);

    const deleted = await lead.delete(`/api/models/${made.id}`).send({});
    expect(deleted.status).toBe(204);
    expect(await t.db.getRepository(PotentialModel).countBy({ id: made.id })).toBe(0);
    expect((await member.get(`/api/models/${made.id}`)).status).toBe(404);
    expect((await lead.delete(`/api/models/${made.id}`).send({})).status).toBe(404);
    const henrik = await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauLead });
    const events = await t.db.getRepository(AuditEvent).findBy({ action: 'model.delete', targetId: String(made.id) });
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({ actorId: henrik.id, groupId: plateauId, details: { name: `${PREFIX}: to delete`, scans: 1 } });

    // The scan lost its link to the model but kept the definition it was submitted with.
    const scan = await t.db.getRepository(Scan).findOneByOrFail({ id: scanId });
    expect(scan.modelId).toBeNull();
    expect((scan.spec as unknown as StoredScanSpec).potentialSource).toBe('0.5 * m^2 * phi^2');
    const worker = spawn(process.execPath, [WORKER_MAIN], { env: process.env, stdio: 'ignore' });
    try {
      const done = await until(async () => {
        const res = await member.get(`/api/scans/${scanId}`);
        return res.body.status === 'completed' ? res.body : undefined;
      }, 'the scan of the deleted model to complete');
      expect(done).toMatchObject({ donePoints: 2, failedPoints: 0 });
    } finally {
      await new Promise<void>((resolve) => { worker.once('exit', () => resolve()); worker.kill('SIGTERM'); });
    }
    const points = await t.db.getRepository(ScanPoint).find({ where: { scanId }, order: { pointIndex: 'ASC' } });
    expect(points.map((p) => [p.status, p.nStar])).toEqual([['ok', 50], ['ok', 55]]);
    // For m²φ²/2, slow roll gives n_s ≈ 1 − 2/(N + 1/2): a real result, not an empty row.
    expect(points[0].ns).toBeCloseTo(1 - 2 / 50.5, 2);
  }, 90_000);
});
