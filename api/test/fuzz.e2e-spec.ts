import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import fc from 'fast-check';
import { parse as parseQueryString } from 'node:querystring';
import { Like } from 'typeorm';
import {
  constraintRegionUploadSchema, createScanSchema, MODEL_FILE_FORMAT, MODEL_FILE_VERSION, modelInputSchema, modelUpdateSchema, POINT_OUTPUTS, readModelFile,
  scanGridQuerySchema, scanPlaneQuerySchema, scanPointsQuerySchema,
} from '@sixtyfold/shared';
import { ConstraintRegion } from '../src/constraint-regions/entities/constraint-region.entity';
import { Group } from '../src/groups/entities/group.entity';
import { PotentialModel } from '../src/models/entities/potential-model.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import {
  badValue, bodyInputs, checkAnswer, checkSchemaRefusal, csvNumberText, expectStatus, FUZZ_SEED, FuzzTally, junkJson, nearValid, oddCell, spoiledCsv, timed,
  type Answer, type JsonInput,
} from './support/fuzz';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { until } from './support/until';
import { startWorkers, stopWorkers } from './support/workers';

/**
 * Property tests against the running API: generated bodies, query strings and files (valid,
 * near-valid and junk) for the scan, model and upload routes. Every answer must be 2xx or 4xx
 * within 2 s, a 4xx must say which field or line is wrong, and wherever the shared schema refuses
 * an input, the API must refuse it naming the same fields. `FUZZ_SEED=<n>` replays a run; the
 * counts per target are printed at the end.
 */

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
const UPLOAD_HEADER = ['X-Sixtyfold-Request', 'upload'] as const;
// Everything this file stores lives in this group, which is removed at the end.
const GROUP_NAME = 'Fuzz checks';
// Accepted scans stay tiny: the group refuses more points than this.
const GROUP_POINT_LIMIT = 64;
const FUZZ_TIMEOUT_MS = 240_000;

const tally = new FuzzTally();
let nextTarget = 0;

/**
 * Runs one target's property in `lanes` concurrent runs (the API answers several requests at
 * once; one after the other the suite took minutes), `runs` inputs in all. Lane i of target t has
 * the seed FUZZ_SEED + 10 t + i, so a failure names a seed that replays it.
 */
async function fuzz<T>(target: string, runs: number, inputs: fc.Arbitrary<T>, send: (input: T) => Promise<Answer>, lanes = 3): Promise<void> {
  const first = FUZZ_SEED + 10 * nextTarget++;
  await Promise.all(
    Array.from({ length: lanes }, (_, lane) =>
      fc.assert(
        fc.asyncProperty(inputs, async (input) => {
          const answer = await send(input);
          tally.record(target, first, answer, input);
        }),
        { seed: first + lane, numRuns: Math.ceil(runs / lanes) },
      ),
    ),
  );
}

const finiteIn = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
/** Drops undefined fields, as sending the value would. */
const plain = <T>(value: T): T => JSON.parse(JSON.stringify(value)) as T;

interface ModelChoice {
  model: { kind: 'family'; family: string } | { kind: 'group'; modelId: number };
  params: string[];
}

describe('fuzzing the scan, model and upload routes', () => {
  let t: TestApp;
  let admin: Agent;
  let groupId: number;
  let plateauModelId: number;
  let gridScanId: number;
  let listScanId: number;
  let models: ModelChoice[];

  beforeAll(async () => {
    // Three lanes may download at once as the one admin: the export limits are streams.e2e-spec's subject, not this file's.
    t = await createTestApp({ EXPORTS_PER_USER: '8', EXPORTS_PER_SITE: '8' });
    // A site admin acts as a lead in every group: one sign-in serves the whole file.
    admin = await t.signIn(DEMO.admin);
    const group = await admin.post('/api/groups').send({ name: GROUP_NAME, description: 'generated inputs', pointLimit: GROUP_POINT_LIMIT });
    expect(group.status).toBe(201);
    groupId = group.body.id;
    const model = await admin.post('/api/models').send({
      groupId,
      name: 'fuzz plateau',
      expression: 'V0 * (1 - exp(-m * phi))^2',
      parameters: [{ name: 'V0', defaultValue: 1e-10, min: 1e-12, max: 1e-8 }, { name: 'm', defaultValue: 0.8, min: 0.1, max: 2 }],
      phiInit: 5.5,
    });
    expect(model.status).toBe(201);
    plateauModelId = model.body.id;
    models = [
      { model: { kind: 'family', family: 'natural' }, params: ['Lambda', 'f'] },
      { model: { kind: 'family', family: 'monomial' }, params: ['lambda', 'p'] },
      { model: { kind: 'family', family: 'starobinsky' }, params: ['mu'] },
      { model: { kind: 'group', modelId: plateauModelId }, params: ['V0', 'm'] },
    ];

    // One stored grid scan and one stored list scan, computed by real workers, for the read routes.
    const workers = startWorkers(2);
    try {
      const settings = { groupId, model: { kind: 'family', family: 'natural' }, params: { Lambda: 5e-3 }, pivot: { kind: 'fixed' }, method: 'slowroll' };
      const grid = await admin.post('/api/scans').send({
        ...settings,
        name: 'fuzz grid',
        axes: [{ kind: 'range', parameter: 'f', min: 5, max: 10, count: 3 }, { kind: 'list', parameter: 'nStar', values: [50, 55, 60] }],
      });
      expect(grid.status).toBe(201);
      gridScanId = grid.body.id;
      const list = await admin
        .post('/api/scans/upload')
        .set(...UPLOAD_HEADER)
        .field('spec', JSON.stringify({ ...settings, name: 'fuzz list' }))
        .attach('points', Buffer.from('f,nStar\n5,50\n7.5,55\n10,60\n'), { filename: 'points.csv', contentType: 'text/csv' });
      expect(list.status).toBe(201);
      listScanId = list.body.id;
      for (const id of [gridScanId, listScanId]) {
        await until(async () => ((await admin.get(`/api/scans/${id}`)).body.status === 'completed' ? true : undefined), `scan ${id} to complete`);
      }
    } finally {
      await stopWorkers(workers);
    }
  }, 180_000);

  afterAll(async () => {
    process.stdout.write(`\n${tally.report()}\n`);
    if (t) {
      if (groupId) {
        // Scans cascade to their points and tags; the group goes last. An input with a broken
        // groupId may have landed in another group (a site admin may add anywhere), under its generated name.
        for (const where of [{ groupId }, { name: Like('fuzz %') }]) {
          await t.db.getRepository(Scan).delete(where);
          await t.db.getRepository(ConstraintRegion).delete(where);
          await t.db.getRepository(PotentialModel).delete(where);
        }
        await t.db.getRepository(Group).delete({ id: groupId });
      }
      await t.close();
    }
  });

  // ---------------------------------------------------------------------------------------------
  // Generators that need the group and its model

  /**
   * Whether a (broken) groupId names one of the seeded groups, made before ours: a site admin may
   * add there, and the other test files count what those groups hold, so such inputs are skipped.
   * Ids past ours (no such group) are sent.
   */
  const inAnotherGroup = (id: unknown) => {
    const n = typeof id === 'string' ? Number(id.trim()) : id;
    return typeof n === 'number' && Number.isInteger(n) && n > 0 && n < groupId;
  };
  const bodyGroup = (value: unknown) => (value && typeof value === 'object' ? (value as { groupId?: unknown }).groupId : undefined);
  const specGroup = (text: string) => {
    try {
      return bodyGroup(JSON.parse(text));
    } catch {
      return undefined;
    }
  };
  const fieldsGroup = (fields: [string, string][]) => fields.some(([name, value]) => (name === 'groupId' && inAnotherGroup(value)) || (name === 'spec' && inAnotherGroup(specGroup(value))));

  /** The settings of a scan without its points, over one of the models, and what the points vary. */
  function scanSettings(shape: 'grid' | 'list') {
    return fc.tuple(fc.constantFrom(...models), fc.constantFrom('fixed', 'reheating')).chain(([choice, pivotKind]) => {
      const candidates = [...choice.params, ...(pivotKind === 'fixed' ? ['nStar'] : ['reheatingW', 'reheatingEnergyGeV'])];
      return fc.subarray(candidates, { minLength: 1, maxLength: Math.min(candidates.length, shape === 'grid' ? 2 : 3) }).chain((varied) => {
        const fixable = choice.params.filter((p) => !varied.includes(p));
        const pivot =
          pivotKind === 'fixed'
            ? varied.includes('nStar') ? fc.constant({ kind: 'fixed' }) : finiteIn(40, 70).map((nStar) => ({ kind: 'fixed', nStar }))
            : fc.record({
                kind: fc.constant('reheating'),
                w: varied.includes('reheatingW') ? fc.constant(undefined) : finiteIn(-0.3, 1),
                energyGeV: varied.includes('reheatingEnergyGeV') ? fc.constant(undefined) : finiteIn(1e3, 1e15),
              });
        return fc
          .record({
            groupId: fc.constant(groupId),
            name: fc.string({ unit: 'grapheme', maxLength: 30 }).map((s) => `fuzz ${s}`),
            tags: fc.uniqueArray(fc.stringMatching(/^[a-z0-9-]{1,12}$/), { maxLength: 3 }),
            note: fc.string({ maxLength: 40 }),
            model: fc.constant(choice.model),
            params: fc.subarray(fixable).chain((names) => fc.tuple(...names.map(() => finiteIn(1e-6, 10))).map((values) => Object.fromEntries(names.map((n, i) => [n, values[i]])))),
            phiInit: fc.option(finiteIn(0.1, 20), { nil: undefined }),
            pivot,
            method: fc.constantFrom('slowroll', 'exact'),
            tolerance: fc.option(finiteIn(1e-12, 1e-5), { nil: undefined }),
          })
          .map((settings) => ({ settings: plain(settings), varied }));
      });
    });
  }

  const axisOver = (parameter: string) =>
    fc.oneof(
      fc
        .record({ min: finiteIn(0.1, 5), span: finiteIn(0.01, 5), count: fc.integer({ min: 1, max: 4 }), spacing: fc.constantFrom('linear', 'log') })
        .map(({ min, span, count, spacing }) => ({ kind: 'range', parameter, min, max: min + span, count, spacing })),
      fc.array(finiteIn(-10, 10), { minLength: 1, maxLength: 4 }).map((values) => ({ kind: 'list', parameter, values })),
    );

  const gridScan = () => scanSettings('grid').chain(({ settings, varied }) => fc.tuple(...varied.map(axisOver)).map((axes) => plain({ ...settings, axes })));

  /** A points file for `columns`: 1 to 5 rows of numbers, each written as people write numbers. */
  const pointsCsv = (columns: string[]) =>
    fc
      .array(fc.tuple(...columns.map(() => finiteIn(0.01, 80).chain(csvNumberText))), { minLength: 1, maxLength: 5 })
      .map((rows) => `${columns.join(',')}\n${rows.map((r) => r.join(',')).join('\n')}\n`);

  const parameterName = fc.oneof(
    fc.stringMatching(/^[A-Za-z][A-Za-z0-9_]{0,6}$/),
    fc.constantFrom('phi', 'e', 'pi', 'exp', 'sin', 'mod', 'and', 'x1', 'Lambda', 'V0', 'a_b'),
  );

  /** Expressions in phi and `names`: numbers, sums, products, quotients, powers and a few functions. */
  const expressionOver = (names: string[]) =>
    fc.letrec<{ node: string; leaf: string; binary: string; call: string; power: string }>((tie) => ({
      node: fc.oneof({ maxDepth: 3, depthSize: 'small' }, tie('leaf'), tie('binary'), tie('call'), tie('power')),
      leaf: fc.oneof(fc.constant('phi'), ...(names.length ? [fc.constantFrom(...names)] : []), finiteIn(0.01, 10).map((n) => String(+n.toPrecision(4)))),
      binary: fc.tuple(tie('node'), fc.constantFrom('+', '-', '*', '/'), tie('node')).map(([a, op, b]) => `(${a} ${op} ${b})`),
      call: fc.tuple(fc.constantFrom('exp', 'cos', 'sin', 'tanh', 'sqrt', 'log', 'cosh', 'abs'), tie('node')).map(([f, a]) => `${f}(${a})`),
      power: fc.tuple(tie('node'), fc.integer({ min: 1, max: 4 })).map(([a, n]) => `(${a})^${n}`),
    })).node;

  /** Expressions near the length limit, deeply nested or with many terms: the costly ones to check. */
  const longExpression = fc.tuple(fc.integer({ min: 1, max: 450 }), fc.constantFrom('sin(', 'exp(', '(1 + ', 'sqrt(', 'tanh(phi * ')).map(([n, open]) => {
    const nested = `${open.repeat(n)}phi${')'.repeat(n)}`;
    const terms = Array.from({ length: n }, (_, i) => `${open}${i + 1} * phi)`).join(' + ');
    const products = `${'phi * '.repeat(n)}phi`;
    return [nested, terms, products, `(${terms})^3`][n % 4].slice(0, 1990 + (n % 20));
  });

  /** A model's fields as the form sends them (usually valid; the name rules and the expression decide). */
  const modelFields = fc.uniqueArray(parameterName, { maxLength: 3 }).chain((names) =>
    fc.record({
      name: fc.string({ unit: 'grapheme', maxLength: 30 }).map((s) => `fuzz model ${s}`),
      expression: fc.oneof(
        { arbitrary: expressionOver(names).map((e) => (names.length ? `${names[0]} * ${e}` : e)), weight: 6 },
        { arbitrary: fc.string({ maxLength: 40 }), weight: 1 },
        { arbitrary: longExpression, weight: 1 },
      ),
      parameters: fc.tuple(
        ...names.map((name) =>
          fc.record({ min: finiteIn(-10, 10), span: finiteIn(0.1, 10), at: finiteIn(0, 1), description: fc.string({ maxLength: 30 }) })
            .map(({ min, span, at, description }) => ({ name, defaultValue: min + span * at, min, max: min + span, description })),
        ),
      ),
      phiInit: finiteIn(-20, 20),
      description: fc.string({ maxLength: 60 }),
    }).map(plain),
  );

  /** Sends a JSON body as text, so that duplicate keys, 1e400 and broken JSON reach the API as generated. */
  const sendJson = (method: 'post' | 'patch', url: string, input: JsonInput) => timed(() => admin[method](url).set('Content-Type', 'application/json').send(input.text));

  // ---------------------------------------------------------------------------------------------
  // Bodies

  it('POST /api/scans: generated grid scans are stored (then cancelled), or refused naming their fields', async () => {
    let accepted = 0;
    await fuzz('POST /api/scans', 1000, bodyInputs(gridScan(), { valid: 1, near: 6, junk: 3 }).filter((input) => !inAnotherGroup(bodyGroup(input.value))), async (input) => {
      const answer = await sendJson('post', '/api/scans', input);
      checkAnswer(answer, input, 'body');
      if (input.value !== undefined) checkSchemaRefusal(answer, input, createScanSchema.safeParse(input.value));
      if (input.how === 'valid') expectStatus(answer, [201], input);
      if (answer.status === 201) {
        accepted++;
        // Nothing is left for the workers of later test files.
        expect((await admin.post(`/api/scans/${answer.body.id}/cancel`).send({})).status).toBe(200);
      }
      return answer;
    });
    expect(accepted).toBeGreaterThan(50);
    expect(await t.db.getRepository(Scan).countBy({ groupId, status: 'queued' })).toBe(0);
  }, FUZZ_TIMEOUT_MS);

  it('POST /api/models and PATCH /api/models/:id: generated models are stored or refused naming their fields', async () => {
    const modelBody = modelFields.map((m) => ({ groupId, ...m }));
    await fuzz('POST /api/models', 1200, bodyInputs(modelBody, { valid: 4, near: 5, junk: 1 }).filter((input) => !inAnotherGroup(bodyGroup(input.value))), async (input) => {
      const answer = await sendJson('post', '/api/models', input);
      checkAnswer(answer, input, 'body');
      if (input.value !== undefined) {
        const local = modelInputSchema.safeParse(input.value);
        checkSchemaRefusal(answer, input, local);
        // A broken groupId may name a group that does not exist (404) or, for a site admin, another one.
        if (local.success) expectStatus(answer, local.data.groupId === groupId ? [201, 409] : [201, 404, 409], input);
      }
      return answer;
    });

    // Changes to one model of its own (the scans use the plateau): any subset of its fields, checked against what is stored at the time.
    const target = await admin.post('/api/models').send({ groupId, name: 'fuzz patch target', expression: 'lambda * phi^4', parameters: [{ name: 'lambda', defaultValue: 1e-13 }], phiInit: 22 });
    expect(target.status).toBe(201);
    const changes = modelFields.chain((m) => fc.subarray(Object.keys(m) as (keyof typeof m)[]).map((keys) => Object.fromEntries(keys.map((k) => [k, m[k]]))));
    await fuzz('PATCH /api/models/:id', 600, bodyInputs(changes, { valid: 5, near: 4, junk: 1 }), async (input) => {
      const answer = await sendJson('patch', `/api/models/${target.body.id}`, input);
      checkAnswer(answer, input, 'body');
      if (input.value !== undefined) checkSchemaRefusal(answer, input, modelUpdateSchema.safeParse(input.value));
      return answer;
    }, 1); // one lane: every change lands on the same model
  }, FUZZ_TIMEOUT_MS);

  // ---------------------------------------------------------------------------------------------
  // Query strings

  /** A query string from pairs, most encoded, some raw (so that %, & and = reach the parser as typed). */
  const queryString = (pairs: [string, string, boolean][]) =>
    pairs.map(([k, v, raw]) => (raw ? `${k}=${v}` : `${encodeURIComponent(k)}=${encodeURIComponent(v)}`)).join('&');

  const oddQueryValue = fc.oneof(
    fc.constantFrom('', ' ', '-1', '0', '1.5', '1e400', '-1e400', 'NaN', 'Infinity', '0x10', '9'.repeat(400), 'asc ', 'ASC', 'csv,json', '%', '%zz', '١', 'true', '[]', '{}'),
    fc.string({ unit: 'grapheme', maxLength: 16 }),
    fc.integer().map(String),
    fc.double().map(String),
  );
  const oddQueryKey = fc.oneof(
    fc.constantFrom('page', 'pageSize', 'sort', 'order', 'status', 'format', 'limit', 'x', 'y', 'output', 'at', 'at.', 'at.f', 'at.zz', 'at.__proto__', 'input.', 'input.f_min', 'input.zz_max', 'input.f_mid', 'ns_min', 'r_max', '__proto__', 'constructor', 'toString', 'a[b]', 'page[]'),
    fc.string({ maxLength: 12 }),
  );

  /** Query inputs: valid pairs from `valid`, plus odd keys and values and repeated keys. */
  function queryInputs(valid: fc.Arbitrary<[string, string][]>) {
    return fc
      .tuple(valid, fc.array(fc.tuple(oddQueryKey, oddQueryValue, fc.boolean()), { maxLength: 3 }), fc.nat(3))
      .map(([pairs, odd, mode]) => {
        const all: [string, string, boolean][] = pairs.map(([k, v]) => [k, v, false]);
        if (mode >= 1) all.push(...odd);
        if (mode === 3 && pairs.length) all.push([pairs[0][0], pairs[0][1], false]); // a repeated key arrives as an array
        return queryString(all);
      });
  }

  async function sendQuery(url: string, query: string, check?: (parsed: Record<string, unknown>, answer: Answer) => void): Promise<Answer> {
    const answer = await timed(() => admin.get(`${url}?${query}`));
    checkAnswer(answer, query, 'query');
    // What follows # is a fragment, which never reaches the server.
    check?.({ ...parseQueryString(query.split('#')[0]) }, answer);
    return answer;
  }

  const pointsPairs = (axes: string[]) =>
    fc
      .record(
        {
          page: fc.integer({ min: 1, max: 3 }).map(String),
          pageSize: fc.integer({ min: 1, max: 1000 }).map(String),
          sort: fc.constantFrom('pointIndex', ...POINT_OUTPUTS, ...axes.map((a) => `input.${a}`)),
          order: fc.constantFrom('asc', 'desc'),
          status: fc.constantFrom('ok', 'failed', 'no_end'),
          format: fc.constantFrom('csv', 'json'),
          ns_min: finiteIn(0.9, 1).map(String),
          r_max: finiteIn(0, 0.5).map(String),
          range: fc.tuple(fc.constantFrom(...axes), fc.constantFrom('min', 'max'), finiteIn(0, 80)),
        },
        { requiredKeys: [] },
      )
      .map(({ range, ...rest }) => {
        const pairs: [string, string][] = Object.entries(rest);
        if (range) pairs.push([`input.${range[0]}_${range[1]}`, String(range[2])]);
        return pairs;
      });

  it('GET /api/scans/:id/points: generated query strings on a grid scan and a list scan', async () => {
    for (const [target, id, runs] of [['GET points (grid scan)', gridScanId, 1500], ['GET points (list scan)', listScanId, 900]] as const) {
      await fuzz(target, runs, queryInputs(pointsPairs(['f', 'nStar'])), async (query) =>
        sendQuery(`/api/scans/${id}/points`, query, (parsed, answer) => {
          const local = scanPointsQuerySchema.safeParse(parsed);
          checkSchemaRefusal(answer, query, local);
          if (local.success && !/zz/.test(query)) expectStatus(answer, [200], query);
        }),
      );
    }
  }, FUZZ_TIMEOUT_MS);

  it('GET /api/scans/:id/grid and /plane: generated query strings on a grid scan and a list scan', async () => {
    const gridPairs = fc
      .record(
        {
          x: fc.constantFrom('f', 'nStar'),
          y: fc.constantFrom('nStar', 'f'),
          output: fc.constantFrom(...POINT_OUTPUTS, 'status'),
          at: fc.tuple(fc.constantFrom('f', 'nStar'), fc.integer({ min: 0, max: 3 })),
        },
        { requiredKeys: ['x', 'y'] },
      )
      .map(({ at, ...rest }) => {
        const pairs: [string, string][] = Object.entries(rest);
        if (at) pairs.push([`at.${at[0]}`, String(at[1])]);
        return pairs;
      });
    for (const [target, id, runs] of [['GET grid (grid scan)', gridScanId, 1000], ['GET grid (list scan)', listScanId, 300]] as const) {
      await fuzz(target, runs, queryInputs(gridPairs), async (query) =>
        sendQuery(`/api/scans/${id}/grid`, query, (parsed, answer) => {
          const local = scanGridQuerySchema.safeParse(parsed);
          checkSchemaRefusal(answer, query, local);
          if (local.success && id === listScanId) expectStatus(answer, [409], query);
        }),
      );
    }
    const planePairs = fc.option(fc.integer({ min: 1, max: 100_000 }), { nil: undefined }).map((limit): [string, string][] => (limit === undefined ? [] : [['limit', String(limit)]]));
    await fuzz('GET plane (both scans)', 600, fc.tuple(fc.boolean(), queryInputs(planePairs)), async ([onGrid, query]) =>
      sendQuery(`/api/scans/${onGrid ? gridScanId : listScanId}/plane`, query, (parsed, answer) => {
        const local = scanPlaneQuerySchema.safeParse(parsed);
        checkSchemaRefusal(answer, query, local);
        if (local.success) expectStatus(answer, [200], query);
      }),
    );
  }, FUZZ_TIMEOUT_MS);

  // ---------------------------------------------------------------------------------------------
  // Uploads

  interface UploadInput {
    fields: [string, string][];
    file?: { bytes: Buffer; filename: string; contentType: string };
    how: string;
  }

  function sendUpload(url: string, fileField: string, input: UploadInput): Promise<Answer> {
    return timed(() => {
      let req = admin.post(url).set(...UPLOAD_HEADER);
      for (const [name, value] of input.fields) req = req.field(name, value);
      if (input.file) req = req.attach(fileField, input.file.bytes, { filename: input.file.filename, contentType: input.file.contentType });
      return req;
    });
  }

  const fileKinds = (name: string, type: string) =>
    fc.oneof(
      { arbitrary: fc.constant({ filename: name, contentType: type }), weight: 12 },
      { arbitrary: fc.constantFrom({ filename: 'upload.bin', contentType: 'application/octet-stream' }, { filename: name.toUpperCase(), contentType: 'text/plain' }, { filename: 'noextension', contentType: type }), weight: 1 },
    );

  /** Bytes that are not text, text that is not the format, and very long text. */
  const junkFile = fc.oneof(
    fc.uint8Array({ maxLength: 200 }).map((b) => Buffer.from(b)),
    fc.string({ unit: 'grapheme', maxLength: 200 }).map((s) => Buffer.from(s)),
    fc.constantFrom(Buffer.from([0xff, 0xfe, 0x00, 0x41]), Buffer.from([0xc3, 0x28]), Buffer.alloc(0), Buffer.from('x'.repeat(300_000))),
  );

  /** Fields beside a file: one broken, one repeated, an unknown one, or one longer than the multipart limit. */
  function spoilFields(fields: [string, string][], pick: number, bad: unknown): { fields: [string, string][]; how: string } {
    const [name] = fields[pick % fields.length];
    const text = typeof bad === 'string' ? bad : JSON.stringify(bad) ?? '';
    switch (pick % 5) {
      case 0:
        return { fields: fields.map(([n, v]) => [n, n === name ? text : v]), how: `${name} as ${text.slice(0, 40)}` };
      case 1:
        return { fields: fields.filter(([n]) => n !== name), how: `no ${name}` };
      case 2:
        return { fields: [...fields, [name, text]], how: `${name} twice` };
      case 3:
        return { fields: [...fields, [`extra${pick % 7}`, text], ['a[b][c]', '1']], how: 'unknown fields' };
      default:
        return { fields: fields.map(([n, v]) => [n, n === name ? v.padEnd(70 * 1024, ' ') : v]), how: `${name} over 64 kB` };
    }
  }

  it('POST /api/scans/upload: generated settings and points files', async () => {
    const validUpload = scanSettings('list').chain(({ settings, varied }) =>
      pointsCsv(varied).map((csv) => ({ spec: JSON.stringify(settings), csv })),
    );
    const csvFile = (text: string) => ({ bytes: Buffer.from(text), filename: 'points.csv', contentType: 'text/csv' });
    const inputs: fc.Arbitrary<UploadInput> = fc.oneof(
      { arbitrary: validUpload.map(({ spec, csv }): UploadInput => ({ fields: [['spec', spec]], file: csvFile(csv), how: 'valid' })), weight: 2 },
      {
        arbitrary: fc.tuple(validUpload, fc.nat(), oddCell).map(([{ spec, csv }, pick, cell]): UploadInput => {
          const spoiled = spoiledCsv(csv, pick, cell);
          return { fields: [['spec', spec]], file: csvFile(spoiled.text), how: spoiled.how };
        }),
        weight: 4,
      },
      {
        arbitrary: fc.tuple(scanSettings('list').chain(({ settings, varied }) => fc.tuple(nearValid(fc.constant(settings)), pointsCsv(varied)))).map(([[spec, csv]]): UploadInput => ({
          fields: [['spec', spec.text]],
          file: csvFile(csv),
          how: `spec: ${spec.how}`,
        })),
        weight: 3,
      },
      {
        arbitrary: fc.tuple(validUpload, fc.nat(), badValue, junkFile, fileKinds('points.csv', 'text/csv'), junkJson).map(([{ spec, csv }, pick, bad, junk, kind, junkSpec]) => {
          const spoiled = spoilFields([['spec', spec]], pick, bad);
          const variants: UploadInput[] = [
            { ...spoiled, file: csvFile(csv) },
            { fields: [['spec', spec]], file: { bytes: junk, ...kind }, how: 'a junk file' },
            { fields: [['spec', junkSpec.text]], file: csvFile(csv), how: 'junk settings' },
            { fields: [['spec', spec]], how: 'no file' },
            { fields: [['spec', spec]], file: { bytes: Buffer.from(csv), ...kind }, how: `a file named ${kind.filename}` },
          ];
          return variants[pick % variants.length];
        }),
        weight: 2,
      },
    );
    await fuzz('POST /api/scans/upload', 800, inputs.filter((input) => !fieldsGroup(input.fields)), async (input) => {
      const answer = await sendUpload('/api/scans/upload', 'points', input);
      checkAnswer(answer, input, 'upload');
      if (input.how === 'valid') expectStatus(answer, [201], input);
      if (answer.status === 201) expect((await admin.post(`/api/scans/${answer.body.id}/cancel`).send({})).status).toBe(200);
      return answer;
    });
  }, FUZZ_TIMEOUT_MS);

  it('POST /api/models/import: generated model files', async () => {
    const modelFile = modelFields.map((m) => ({ format: MODEL_FILE_FORMAT, version: MODEL_FILE_VERSION, ...m }));
    const layout = fc.record({ indent: fc.constantFrom(0, 2, 4, '\t'), crlf: fc.boolean(), bom: fc.boolean() });
    const asText = (value: unknown, { indent, crlf, bom }: { indent: number | string; crlf: boolean; bom: boolean }) => {
      const text = JSON.stringify(value, null, indent) ?? '';
      return `${bom ? '\uFEFF' : ''}${crlf ? text.replace(/\n/g, '\r\n') : text}`;
    };
    const jsonFile = (text: string | Buffer) => ({ bytes: Buffer.isBuffer(text) ? text : Buffer.from(text), filename: 'model.potential.json', contentType: 'application/json' });
    const groupField = (): [string, string][] => [['groupId', String(groupId)]];
    const inputs: fc.Arbitrary<UploadInput & { text?: string }> = fc.oneof(
      { arbitrary: fc.tuple(modelFile, layout).map(([m, l]) => ({ fields: groupField(), file: jsonFile(asText(m, l)), text: asText(m, l), how: 'valid' })), weight: 3 },
      { arbitrary: fc.tuple(nearValid(modelFile), layout).map(([m, l]) => ({ fields: groupField(), file: jsonFile(l.crlf ? m.text.replace(/,/g, ',\r\n') : m.text), text: l.crlf ? m.text.replace(/,/g, ',\r\n') : m.text, how: m.how })), weight: 5 },
      {
        arbitrary: fc.tuple(modelFile, layout, fc.nat()).map(([m, l, cut]) => {
          const text = asText(m, l);
          const broken = [text.slice(0, cut % Math.max(1, text.length)), text.replace(/}$/, ',}'), text.replace(/"/g, "'"), `// exported\n${text}`, `${text}\n${text}`, `[${text}]`][cut % 6];
          return { fields: groupField(), file: jsonFile(broken), text: broken, how: 'broken JSON' };
        }),
        weight: 2,
      },
      { arbitrary: junkJson.map((j) => ({ fields: groupField(), file: jsonFile(j.text), text: j.text, how: `junk: ${j.how}` })), weight: 1 },
      {
        arbitrary: fc.tuple(modelFile, fc.nat(), badValue, junkFile, fileKinds('model.json', 'application/json')).map(([m, pick, bad, junk, kind]) => {
          const text = JSON.stringify(m);
          const variants: UploadInput[] = [
            { ...spoilFields(groupField(), pick, bad), file: jsonFile(text) },
            { fields: groupField(), file: jsonFile(junk), how: 'a junk file' },
            { fields: groupField(), how: 'no file' },
            { fields: groupField(), file: { bytes: Buffer.from(text), ...kind }, how: `a file named ${kind.filename}` },
          ];
          return variants[pick % variants.length];
        }),
        weight: 2,
      },
    );
    await fuzz('POST /api/models/import', 1200, inputs.filter((input) => !fieldsGroup(input.fields)), async (input) => {
      const answer = await sendUpload('/api/models/import', 'file', input);
      checkAnswer(answer, input, 'upload');
      if (input.text !== undefined) {
        // The API reads the file with the same reader: its refusal, word for word and on the same line.
        const read = readModelFile(input.text.replace(/^\uFEFF/, ''), groupId);
        if (read.ok) expectStatus(answer, [201, 409], input);
        else expect({ status: answer.status, message: answer.body.message, line: answer.body.line }).toEqual({ status: 400, message: read.message, line: read.line });
      }
      return answer;
    });
  }, FUZZ_TIMEOUT_MS);

  it('POST /api/constraint-regions: generated fields and region files', async () => {
    const regionFields = fc
      .record({
        name: fc.string({ unit: 'grapheme', maxLength: 30 }).map((s) => `fuzz region ${s}`),
        source: fc.string({ unit: 'grapheme', minLength: 1, maxLength: 40 }).map((s) => `survey ${s}`),
        confidenceLevel: finiteIn(0.01, 0.99).chain(csvNumberText),
      })
      .map(({ name, source, confidenceLevel }): [string, string][] => [['groupId', String(groupId)], ['name', name], ['source', source], ['confidenceLevel', confidenceLevel.trim()]]);
    const regionCsv = fc
      .tuple(fc.boolean(), fc.array(fc.tuple(finiteIn(0.9, 1.05).chain(csvNumberText), finiteIn(0, 0.2).chain(csvNumberText)), { minLength: 3, maxLength: 8 }))
      .map(([swapped, rows]) => `${swapped ? 'r,n_s' : 'n_s,r'}\n${rows.map(([ns, r]) => (swapped ? `${r},${ns}` : `${ns},${r}`)).join('\n')}\n`);
    const csvFile = (text: string | Buffer) => ({ bytes: Buffer.isBuffer(text) ? text : Buffer.from(text), filename: 'region.csv', contentType: 'text/csv' });
    const inputs: fc.Arbitrary<UploadInput> = fc.oneof(
      { arbitrary: fc.tuple(regionFields, regionCsv).map(([fields, csv]) => ({ fields, file: csvFile(csv), how: 'valid' })), weight: 3 },
      {
        arbitrary: fc.tuple(regionFields, regionCsv, fc.nat(), oddCell).map(([fields, csv, pick, cell]) => {
          const spoiled = spoiledCsv(csv, pick, cell);
          return { fields, file: csvFile(spoiled.text), how: spoiled.how };
        }),
        weight: 4,
      },
      { arbitrary: fc.tuple(regionFields, regionCsv, fc.nat(), badValue).map(([fields, csv, pick, bad]) => ({ ...spoilFields(fields, pick, bad), file: csvFile(csv) })), weight: 3 },
      {
        arbitrary: fc.tuple(regionFields, junkFile, fileKinds('region.csv', 'text/csv'), regionCsv, fc.boolean()).map(([fields, junk, kind, csv, noFile]) =>
          noFile ? { fields, how: 'no file' } : { fields, file: { bytes: kind.filename === 'region.csv' ? junk : Buffer.from(csv), ...kind }, how: 'a junk file or name' },
        ),
        weight: 1,
      },
    );
    await fuzz('POST /api/constraint-regions', 1200, inputs.filter((input) => !fieldsGroup(input.fields)), async (input) => {
      const answer = await sendUpload('/api/constraint-regions', 'file', input);
      checkAnswer(answer, input, 'upload');
      const fields = Object.fromEntries(input.fields);
      const repeated = new Set(input.fields.map(([n]) => n)).size !== input.fields.length;
      if (!repeated && !input.fields.some(([, v]) => v.length > 64 * 1024)) {
        const local = constraintRegionUploadSchema.safeParse(fields);
        if (input.file?.filename === 'region.csv') checkSchemaRefusal(answer, input, local);
      }
      if (input.how === 'valid') expectStatus(answer, [201], input);
      return answer;
    });
  }, FUZZ_TIMEOUT_MS);

  it('sends at least 10,000 generated inputs in all', () => {
    expect(tally.total).toBeGreaterThanOrEqual(10_000);
  });
});
