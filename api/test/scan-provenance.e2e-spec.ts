import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { tableFromIPC } from 'apache-arrow';
import { execFileSync, type ChildProcess } from 'node:child_process';
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type request from 'supertest';
import { Group } from '../src/groups/entities/group.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { until } from './support/until';
import { startWorkers, stopWorkers } from './support/workers';

// What computed a scan: recorded at submission (build, resolved engine options, spec hash) and by
// the workers for each chunk, then shown by the provenance route and carried by every export.

/** Canonical JSON written here a second time, apart from the API's, so the hash is checked independently. */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const keys = Object.keys(value).sort();
    return `{${keys.map((k) => `${JSON.stringify(k)}:${canonical((value as Record<string, unknown>)[k])}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

function binary(res: request.Response, done: (err: Error | null, body: Buffer) => void): void {
  const stream = res as unknown as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => done(null, Buffer.concat(chunks)));
}

const POINTS = 600;

describe('scan provenance', () => {
  let t: TestApp;
  let groupId: number;
  let workers: ChildProcess[] = [];

  beforeAll(async () => {
    t = await createTestApp();
    groupId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    workers = startWorkers(2);
  });
  afterAll(async () => {
    await stopWorkers(workers);
    await t.close();
  });

  const spec = (name: string) => ({
    groupId, name, tags: [], model: { kind: 'family', family: 'natural' }, params: {}, method: 'slowroll', tolerance: 1e-8, pivot: { kind: 'fixed' },
    axes: [
      { kind: 'range', parameter: 'f', min: 5, max: 12, count: 20, spacing: 'linear' },
      { kind: 'range', parameter: 'nStar', min: 50, max: 60, count: POINTS / 20, spacing: 'linear' },
    ],
  });

  async function computed(agent: ReturnType<typeof request.agent>, name: string): Promise<number> {
    const created = await agent.post('/api/scans').send(spec(name));
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    await until(async () => ((await agent.get(`/api/scans/${id}`)).body.status === 'completed' ? true : undefined), 'the scan to complete');
    return id;
  }

  it('records the build, the options that ran, the spec hash and every chunk run, and shows them', async () => {
    const agent = await t.signIn(DEMO.plateauMember);
    const id = await computed(agent, 'provenance: natural over f and N_*');

    const answer = await agent.get(`/api/scans/${id}/provenance`);
    expect(answer.status).toBe(200);
    const p = answer.body;
    const version = JSON.parse(readFileSync(path.resolve('../shared/package.json'), 'utf8')).version as string;
    const commit = execFileSync('git', ['rev-parse', 'HEAD'], { encoding: 'utf8' }).trim();
    expect(p.recorded).toMatchObject({ engineVersion: version, commit, node: process.version });
    // The spec's tolerance is what the background ran with; slow roll integrates no modes.
    expect(p.recorded.engineOptions).toMatchObject({ method: 'slowroll', background: { integrator: 'cash-karp-rk45', tolerance: 1e-8, maxStep: 2 }, modes: null });
    expect(p.recorded.engineOptions.budget).toEqual({ evaluations: 50_000_000, steps: 1_000_000, wallTimeMs: null });

    // The hash, recomputed from the stored column's text.
    const [{ spec: raw }] = await t.db.query('SELECT CAST(spec AS CHAR) AS spec FROM scans WHERE id = ?', [id]);
    expect(p.recorded.specSha256).toBe(createHash('sha256').update(canonical(JSON.parse(raw))).digest('hex'));

    // Every position computed by exactly one run of a live worker process, on this build.
    expect(p.runsRecorded).toBe(true);
    const pids = workers.map((w) => String(w.pid));
    const covered = new Array<number>(POINTS).fill(0);
    for (const run of p.runs) {
      expect(pids).toContain(run.worker.split(':').pop());
      expect(run).toMatchObject({ engineVersion: version, commit, node: process.version, pointTimeLimitMs: 20_000 });
      expect(Date.parse(run.finishedAt)).toBeGreaterThanOrEqual(Date.parse(run.startedAt));
      for (let k = run.start; k < run.end; k++) covered[k]++;
    }
    expect(covered.every((n) => n === 1)).toBe(true);
    const [{ n }] = await t.db.query('SELECT COUNT(*) AS n FROM scan_chunk_runs WHERE scan_id = ?', [id]);
    expect(Number(n)).toBe(p.runs.length);
    expect(p.workers.reduce((sum: number, w: { points: number }) => sum + w.points, 0)).toBe(POINTS);
    expect(p.workers.reduce((sum: number, w: { runs: number }) => sum + w.runs, 0)).toBe(p.runs.length);

    // CSV: `#` lines, then the header; a judged export adds its likelihood.
    const csv = await agent.get(`/api/scans/${id}/points?format=csv&likelihood=planck18-bk18`);
    expect(csv.status).toBe(200);
    const lines = csv.text.split('\n');
    const comments = lines.slice(0, lines.findIndex((l) => !l.startsWith('#')));
    expect(comments[0]).toBe(`# sixtyfold scan ${id}: provenance: natural over f and N_*`);
    expect(comments).toContain(`# spec sha256: ${p.recorded.specSha256} (of the stored spec's canonical JSON)`);
    expect(comments).toContain(`# engine options: ${JSON.stringify(p.recorded.engineOptions)}`);
    expect(comments.filter((l) => l.startsWith('# computed by '))).toHaveLength(p.workers.length);
    expect(comments).toContain(`# judged by: ${csv.headers['x-sixtyfold-judged-by']}`);
    expect(lines[comments.length]).toMatch(/^pointIndex,f,nStar,status,/);

    // Arrow: the same record in the schema's metadata; JSON: the array as before, the record in a header.
    const arrow = await agent.get(`/api/scans/${id}/points?format=arrow&likelihood=planck18-bk18`).buffer(true).parse(binary);
    const metadata = tableFromIPC(arrow.body as Buffer).schema.metadata;
    expect(JSON.parse(metadata.get('provenance')!)).toEqual(p);
    expect(metadata.get('judgedBy')).toBe(arrow.headers['x-sixtyfold-judged-by']);
    const json = await agent.get(`/api/scans/${id}/points?format=json`);
    expect(Array.isArray(json.body)).toBe(true);
    expect(JSON.parse(json.headers['x-sixtyfold-provenance'])).toEqual(p.recorded);
    expect(json.headers.link).toBe(`</api/scans/${id}/provenance>; rel="describedby"`);
  });

  it('says "not recorded" for a scan stored before provenance was', async () => {
    const agent = await t.signIn(DEMO.plateauMember);
    const id = await computed(agent, 'provenance: an older scan');
    // As a scan stored before the migration looks.
    await t.db.query('UPDATE scans SET provenance = NULL WHERE id = ?', [id]);
    await t.db.query('DELETE FROM scan_chunk_runs WHERE scan_id = ?', [id]);

    const answer = await agent.get(`/api/scans/${id}/provenance`);
    expect(answer.body).toEqual({ scanId: id, recorded: null, runsRecorded: false, workers: [], runs: [] });
    const csv = await agent.get(`/api/scans/${id}/points?format=csv`);
    expect(csv.text.split('\n').slice(0, 3)).toEqual([
      `# sixtyfold scan ${id}: provenance: an older scan`,
      '# provenance: not recorded (the scan was stored before Sixtyfold recorded it)',
      '# computed by: not recorded',
    ]);
    expect(csv.headers['x-sixtyfold-provenance']).toBe('null');
  });
});
