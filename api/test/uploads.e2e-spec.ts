import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { Like } from 'typeorm';
import { AuditEvent } from '../src/audit/entities/audit-event.entity';
import { ConstraintRegion } from '../src/constraint-regions/entities/constraint-region.entity';
import { Group } from '../src/groups/entities/group.entity';
import { PotentialModel } from '../src/models/entities/potential-model.entity';
import { User } from '../src/users/entities/user.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
// Every region and model this file makes is named so, and removed at the end.
const PREFIX = 'e2e upload';

const csv = (text: string, filename = 'region.csv', contentType = 'text/csv') => ({ buffer: Buffer.from(text), filename, contentType });
const regionCsv = 'n_s,r\n0.955,0\n0.975,0\n0.972,0.03\n0.958,0.03\n';

const modelFile = (name: string) => ({
  format: 'sixtyfold.potential',
  version: 1,
  name,
  expression: 'V0 * (1 - exp(-sqrt(2 / 3) * phi))^2',
  parameters: [{ name: 'V0', defaultValue: 1e-10, min: 1e-12, max: 1e-8, description: 'plateau height' }],
  phiInit: 5.5,
  description: 'a plateau imported from a file',
});
const pretty = (value: unknown) => JSON.stringify(value, null, 2);
// Multipart bodies are not JSON, so the CSRF check wants the app's own request header.
const UPLOAD_HEADER = ['X-Sixtyfold-Request', 'upload'] as const;

describe('uploads: constraint regions (CSV) and model files (JSON)', () => {
  let t: TestApp;
  let plateauId: number;
  let member: Agent;
  let lead: Agent;

  const regionCount = () => t.db.getRepository(ConstraintRegion).countBy({ groupId: plateauId });
  const modelCount = () => t.db.getRepository(PotentialModel).countBy({ groupId: plateauId });

  function uploadRegion(agent: Agent, file: ReturnType<typeof csv>, name = `${PREFIX}: region`) {
    return agent
      .post('/api/constraint-regions')
      .set(...UPLOAD_HEADER)
      .field('groupId', String(plateauId))
      .field('name', name)
      .field('source', 'Invented survey, data release 2')
      .field('confidenceLevel', '0.95')
      .attach('file', file.buffer, { filename: file.filename, contentType: file.contentType });
  }

  function importModel(agent: Agent, text: string, filename = 'model.potential.json', contentType = 'application/json') {
    return agent
      .post('/api/models/import')
      .set(...UPLOAD_HEADER)
      .field('groupId', String(plateauId))
      .attach('file', Buffer.from(text), { filename, contentType });
  }

  beforeAll(async () => {
    t = await createTestApp();
    plateauId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    member = await t.signIn(DEMO.plateauMember);
    lead = await t.signIn(DEMO.plateauLead);
  });
  afterAll(async () => {
    await t.db.getRepository(ConstraintRegion).delete({ name: Like(`${PREFIX}%`) });
    await t.db.getRepository(PotentialModel).delete({ name: Like(`${PREFIX}%`) });
    await t.close();
  });

  describe('constraint regions', () => {
    it('a member uploads a region: 201, listed for the group with the vertices of the file', async () => {
      const res = await uploadRegion(member, csv(`# boundary, clockwise\n${regionCsv}`));
      expect(res.status).toBe(201);
      const lucia = await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauMember });
      const vertices = [{ ns: 0.955, r: 0 }, { ns: 0.975, r: 0 }, { ns: 0.972, r: 0.03 }, { ns: 0.958, r: 0.03 }];
      expect(res.body).toMatchObject({
        groupId: plateauId, name: `${PREFIX}: region`, source: 'Invented survey, data release 2', confidenceLevel: 0.95, vertices, createdById: lucia.id,
      });
      const listed = (await lead.get(`/api/constraint-regions?groupId=${plateauId}`)).body as { id: number; vertices: unknown }[];
      expect(listed.find((r) => r.id === res.body.id)?.vertices).toEqual(vertices);
      const stored = await t.db.getRepository(ConstraintRegion).findOneByOrFail({ id: res.body.id });
      expect(stored.vertices).toEqual(vertices);
    });

    it('a malformed row is refused with its line and reason, and nothing is stored', async () => {
      const before = await regionCount();
      const res = await uploadRegion(member, csv('n_s,r\n0.955,0\n0.975,0\n0.972,abc\n0.958,0.03\n'));
      expect(res.status).toBe(400);
      expect(res.body).toMatchObject({ statusCode: 400, line: 4, message: "line 4: column r is not a finite number ('abc')" });
      const outOfRange = await uploadRegion(member, csv('n_s,r\n0.955,0\n2.4,0\n0.972,0.03\n'));
      expect(outOfRange.status).toBe(400);
      expect(outOfRange.body).toMatchObject({ line: 3, message: 'line 3: n_s must lie between 0 and 2 (found 2.4)' });
      const shortRow = await uploadRegion(member, csv('n_s,r\n0.955,0\n0.975\n0.972,0.03\n'));
      expect(shortRow.body).toMatchObject({ line: 3, message: 'line 3: expected 2 values (n_s, r), found 1' });
      const badQuote = await uploadRegion(member, csv('n_s,r\n0.955,0\n"0.975,0\n0.972,0.03\n'));
      expect(badQuote.status).toBe(400);
      expect(badQuote.body.message).toMatch(/^line \d+: the file is not valid CSV/);
      expect(await regionCount()).toBe(before);
    });

    it('wrong columns are refused with the expected header', async () => {
      const before = await regionCount();
      const res = await uploadRegion(member, csv('ns,tensor\n0.955,0\n0.975,0\n0.972,0.03\n'));
      expect(res.status).toBe(400);
      expect(res.body).toMatchObject({ line: 1 });
      expect(res.body.message).toMatch(/^line 1: unknown columns? ns, tensor; missing columns? n_s, r; the header must name n_s, r$/);
      expect(await regionCount()).toBe(before);
    });

    it('fewer than three vertices is refused, and so is an empty file', async () => {
      const res = await uploadRegion(member, csv('n_s,r\n0.955,0\n0.975,0\n'));
      expect(res.status).toBe(400);
      expect(res.body.message).toBe('a region needs at least 3 vertices, the file has 2');
      expect(res.body.line).toBeUndefined();
      const empty = await uploadRegion(member, csv(''));
      expect(empty.status).toBe(400);
      expect(empty.body.message).toMatch(/the file is empty/);
    });

    it('refuses bad form fields beside a good file', async () => {
      const res = await member
        .post('/api/constraint-regions')
        .set(...UPLOAD_HEADER)
        .field('groupId', String(plateauId))
        .field('name', `${PREFIX}: no level`)
        .field('source', 'x')
        .field('confidenceLevel', '95')
        .attach('file', Buffer.from(regionCsv), { filename: 'region.csv', contentType: 'text/csv' });
      expect(res.status).toBe(400);
      expect(res.body.fieldErrors?.confidenceLevel?.[0]).toMatch(/strictly between 0 and 1/);
    });

    it('a file over 1 MB answers 413 saying the limit', async () => {
      const before = await regionCount();
      const rows = Array.from({ length: 80_000 }, (_, i) => `0.9${String(i).padStart(5, '0')},0.01`).join('\n');
      const big = `n_s,r\n${rows}\n`;
      expect(Buffer.byteLength(big)).toBeGreaterThan(1024 * 1024);
      const res = await uploadRegion(member, csv(big));
      expect(res.status).toBe(413);
      expect(res.body.message).toBe('The file is larger than the limit of 1 MB');
      expect(await regionCount()).toBe(before);
    });

    it('a file of another type answers 415', async () => {
      const png = await uploadRegion(member, { buffer: Buffer.from([0x89, 0x50, 0x4e, 0x47]), filename: 'plot.png', contentType: 'image/png' });
      expect(png.status).toBe(415);
      expect(png.body.message).toMatch(/plot\.png \(image\/png\) is not a CSV file/);
      const jsonNamedCsv = await uploadRegion(member, csv(regionCsv, 'region.json', 'application/json'));
      expect(jsonNamedCsv.status).toBe(415);
    });

    it('a viewer cannot upload; the uploader deletes, and the deletion is audited', async () => {
      const viewer = await t.signIn(DEMO.plateauViewer);
      expect((await uploadRegion(viewer, csv(regionCsv), `${PREFIX}: by viewer`)).status).toBe(403);
      const made = await uploadRegion(member, csv(regionCsv), `${PREFIX}: to delete`);
      expect(made.status).toBe(201);
      expect((await viewer.delete(`/api/constraint-regions/${made.body.id}`).send({})).status).toBe(403);
      expect((await lead.delete(`/api/constraint-regions/${made.body.id}`).send({})).status).toBe(204);
      expect(await t.db.getRepository(ConstraintRegion).existsBy({ id: made.body.id })).toBe(false);
      const henrik = await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauLead });
      const events = await t.db.getRepository(AuditEvent).findBy({ action: 'region.delete', targetId: String(made.body.id) });
      expect(events).toHaveLength(1);
      expect(events[0]).toMatchObject({ actorId: henrik.id, groupId: plateauId, targetType: 'constraint-region', details: { name: `${PREFIX}: to delete` } });
    });

    it('checks the role before reading the file: another group answers 404 and a viewer 403, never a line error', async () => {
      const broken = csv('n_s,r\n0.955,0\nnot-a-number,0\n');
      // The same file from a member shows that it does have a line error to give away.
      const fromMember = await uploadRegion(member, broken, `${PREFIX}: broken`);
      expect(fromMember.status).toBe(400);
      expect(fromMember.body.line).toBe(3);
      const before = await regionCount();
      const outsider = await t.signIn(DEMO.tensorMember);
      const foreign = await uploadRegion(outsider, broken, `${PREFIX}: by outsider`);
      expect(foreign.status).toBe(404);
      expect(foreign.body.line).toBeUndefined();
      expect(foreign.body.message).not.toMatch(/line/);
      const viewer = await t.signIn(DEMO.plateauViewer);
      const byViewer = await uploadRegion(viewer, broken, `${PREFIX}: by viewer`);
      expect(byViewer.status).toBe(403);
      expect(byViewer.body.line).toBeUndefined();
      expect(await regionCount()).toBe(before);
    });
  });

  describe('model files', () => {
    it('imports a model file (201, audited) whose export round-trips to the same JSON', async () => {
      const file = modelFile(`${PREFIX}: plateau`);
      const res = await importModel(member, pretty(file));
      expect(res.status).toBe(201);
      expect(res.body).toMatchObject({ groupId: plateauId, name: file.name, expression: file.expression, parameters: file.parameters, phiInit: 5.5 });
      const events = await t.db.getRepository(AuditEvent).findBy({ action: 'model.create', targetId: String(res.body.id) });
      expect(events).toHaveLength(1);
      const exported = await member.get(`/api/models/${res.body.id}/export`);
      expect(exported.status).toBe(200);
      expect(exported.headers['content-type']).toMatch(/^application\/json/);
      expect(exported.headers['content-disposition']).toBe('attachment; filename="e2e-upload-plateau.potential.json"');
      expect(exported.body).toEqual(file);
    });

    it('a JSON syntax error names its line, and nothing is stored', async () => {
      const before = await modelCount();
      const text = pretty(modelFile(`${PREFIX}: broken`)).replace('"version": 1,', '"version": 1');
      const line = text.split('\n').findIndex((l) => l.includes('"version": 1')) + 2;
      const res = await importModel(member, text);
      expect(res.status).toBe(400);
      expect(res.body).toMatchObject({ line });
      expect(res.body.message).toMatch(new RegExp(`^line ${line}: the file is not valid JSON: comma expected here`));
      expect(await modelCount()).toBe(before);
    });

    it('a value that breaks the format names its line, and nothing is stored', async () => {
      const before = await modelCount();
      const file = modelFile(`${PREFIX}: bad default`);
      const text = pretty({ ...file, parameters: [{ ...file.parameters[0], defaultValue: 'tiny' }] });
      const line = text.split('\n').findIndex((l) => l.includes('"tiny"')) + 1;
      const res = await importModel(member, text);
      expect(res.status).toBe(400);
      expect(res.body).toMatchObject({ line });
      expect(res.body.message).toMatch(new RegExp(`^line ${line}: parameters\\.0\\.defaultValue: `));
      const badExpression = await importModel(member, pretty({ ...file, expression: 'V0 * sinn(phi)' }));
      expect(badExpression.status).toBe(400);
      expect(badExpression.body).toMatchObject({ line: 5 });
      expect(badExpression.body.message).toMatch(/^line 5: expression: /);
      expect(await modelCount()).toBe(before);
    });

    it('a duplicate name answers 409 and stores nothing more', async () => {
      const text = pretty(modelFile(`${PREFIX}: twice`));
      expect((await importModel(member, text)).status).toBe(201);
      const before = await modelCount();
      const again = await importModel(lead, text);
      expect(again.status).toBe(409);
      expect(await modelCount()).toBe(before);
      expect(await t.db.getRepository(PotentialModel).countBy({ groupId: plateauId, name: `${PREFIX}: twice` })).toBe(1);
    });

    it('a file over 256 kB answers 413, another type 415', async () => {
      const file = { ...modelFile(`${PREFIX}: large`), description: 'x'.repeat(300 * 1024) };
      const big = await importModel(member, pretty(file));
      expect(big.status).toBe(413);
      expect(big.body.message).toBe('The file is larger than the limit of 256 kB');
      const csvFile = await importModel(member, regionCsv, 'model.csv', 'text/csv');
      expect(csvFile.status).toBe(415);
      expect(csvFile.body.message).toMatch(/is not a JSON file/);
    });

    it('a viewer cannot import; a group the user is not in answers 404', async () => {
      const viewer = await t.signIn(DEMO.plateauViewer);
      expect((await importModel(viewer, pretty(modelFile(`${PREFIX}: by viewer`)))).status).toBe(403);
      const outsider = await t.signIn(DEMO.tensorMember);
      expect((await importModel(outsider, pretty(modelFile(`${PREFIX}: by outsider`)))).status).toBe(404);
    });
  });
});
