import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { tableFromIPC } from 'apache-arrow';
import http from 'node:http';
import zlib from 'node:zlib';
import { DEMO_PASSWORD } from '../src/database/seeds/demo-scenario';
import { Group } from '../src/groups/entities/group.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';

// A p × N_* grid of 1,200 points; every 7th failed (no outputs, a reason).
const P_COUNT = 24;
const N_COUNT = 50;
const TOTAL = P_COUNT * N_COUNT;
const FAILED = Math.floor((TOTAL - 1) / 7) + 1;
const CSV_HEADER = 'pointIndex,p,nStar,status,failureReason,ns,r,alphaS,As,amplitudeScale,nTotal,phiStar,phiEnd,energyScaleGeV';

interface RawAnswer {
  status: number;
  headers: http.IncomingHttpHeaders;
  /** The bytes as they came over the wire (still compressed, if they were). */
  body: Buffer;
}

/** A GET whose answer is taken as sent: Node's http client decodes nothing itself. */
function rawGet(t: TestApp, path: string, headers: Record<string, string>): Promise<RawAnswer> {
  return new Promise((resolve, reject) => {
    http.get(`${t.url}${path}`, { headers, agent: false }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c)).on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
    }).on('error', reject);
  });
}

function decoded(answer: RawAnswer): Buffer {
  const encoding = answer.headers['content-encoding'];
  if (encoding === 'gzip') return zlib.gunzipSync(answer.body);
  if (encoding === 'br') return zlib.brotliDecompressSync(answer.body);
  return answer.body;
}

/** The CSV as rows of fields (the exported fields hold no commas or quotes). */
function csvRows(text: string): string[][] {
  // The `#` lines above the header say what computed the scan (pandas: comment='#').
  return text.trimEnd().split('\n').filter((line) => !line.startsWith('#')).map((line) => line.split(','));
}

describe('exports: compression and the Arrow format', () => {
  let t: TestApp;
  let scanId: number;
  let cookie: string;

  beforeAll(async () => {
    t = await createTestApp();
    const member = await t.signIn(DEMO.plateauMember);
    const groupId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    const created = await member.post('/api/scans').send({
      groupId, name: 'export formats', model: { kind: 'family', family: 'monomial' },
      axes: [
        { kind: 'range', parameter: 'p', min: 1, max: 3.3, count: P_COUNT, spacing: 'linear' },
        { kind: 'range', parameter: 'nStar', min: 50, max: 60, count: N_COUNT, spacing: 'linear' },
      ],
      pivot: { kind: 'fixed' }, method: 'slowroll',
    });
    expect(created.status).toBe(201);
    scanId = created.body.id;
    expect((await member.post(`/api/scans/${scanId}/cancel`).send({})).status).toBe(200);
    await t.db.query(
      // The axis columns and the scan's counters as the worker would set them: pages and filters read them.
      `INSERT INTO scan_points (scan_id, point_index, inputs, axis_0, axis_1, status, failure_reason, ns, r, alpha_s, a_s, n_star, computed_at)
       SELECT ?, seq, JSON_OBJECT('p', 1 + (seq DIV ${N_COUNT}) * 0.1, 'nStar', 50 + MOD(seq, ${N_COUNT}) * 10 / ${N_COUNT - 1}),
              1 + (seq DIV ${N_COUNT}) * 0.1, 50 + MOD(seq, ${N_COUNT}) * 10 / ${N_COUNT - 1},
              IF(MOD(seq, 7) = 0, 'failed', 'ok'), IF(MOD(seq, 7) = 0, 'no_inflation_end', NULL),
              IF(MOD(seq, 7) = 0, NULL, 0.95 + seq * 1e-5), IF(MOD(seq, 7) = 0, NULL, 0.01), NULL, IF(MOD(seq, 7) = 0, NULL, 2.1e-9),
              50 + MOD(seq, ${N_COUNT}) * 10 / ${N_COUNT - 1}, NOW(3)
         FROM seq_0_to_${TOTAL - 1}`,
      [scanId],
    );
    await t.db.query(
      "UPDATE scans SET done_points = (SELECT COUNT(*) FROM scan_points WHERE scan_id = ? AND status = 'ok'), failed_points = (SELECT COUNT(*) FROM scan_points WHERE scan_id = ? AND status <> 'ok') WHERE id = ?",
      [scanId, scanId, scanId],
    );
    const login = await fetch(`${t.url}/api/auth/login`, {
      method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: DEMO.plateauMember, password: DEMO_PASSWORD }),
    });
    cookie = (login.headers.get('set-cookie') ?? '').split(';')[0];
  }, 120_000);
  afterAll(async () => {
    if (scanId) await t.db.getRepository(Scan).delete({ id: scanId });
    await t.close();
  });

  it.each(['csv', 'json'])('sends the %s export gzip- or brotli-compressed as asked, each decoding to the plain body', async (format) => {
    const path = `/api/scans/${scanId}/points?format=${format}`;
    const plain = await rawGet(t, path, { cookie, 'accept-encoding': 'identity' });
    expect(plain.status).toBe(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    for (const encoding of ['gzip', 'br']) {
      const compressed = await rawGet(t, path, { cookie, 'accept-encoding': encoding });
      expect(compressed.status).toBe(200);
      expect(compressed.headers['content-encoding']).toBe(encoding);
      expect(compressed.headers.vary).toMatch(/Accept-Encoding/i);
      expect(compressed.body.length).toBeLessThan(plain.body.length / 3);
      expect(decoded(compressed).equals(plain.body)).toBe(true);
    }
    // Brotli when the client takes both, as browsers do.
    expect((await rawGet(t, path, { cookie, 'accept-encoding': 'gzip, deflate, br' })).headers['content-encoding']).toBe('br');
  });

  it('compresses JSON pages, but neither tiny answers nor the Arrow stream', async () => {
    const page = await rawGet(t, `/api/scans/${scanId}/points?pageSize=200`, { cookie, 'accept-encoding': 'gzip' });
    expect(page.headers['content-encoding']).toBe('gzip');
    expect((JSON.parse(decoded(page).toString('utf8')) as { items: unknown[] }).items).toHaveLength(200);
    const tiny = await rawGet(t, '/api/health', { 'accept-encoding': 'gzip, br' });
    expect(tiny.status).toBe(200);
    expect(tiny.body.length).toBeLessThan(1024);
    expect(tiny.headers['content-encoding']).toBeUndefined();
    const arrow = await rawGet(t, `/api/scans/${scanId}/points?format=arrow`, { cookie, 'accept-encoding': 'gzip, br' });
    expect(arrow.headers['content-encoding']).toBeUndefined();
    expect(tableFromIPC(arrow.body).numRows).toBe(TOTAL);
  });

  it('exports Arrow with the rows and columns of the CSV', async () => {
    const csv = await rawGet(t, `/api/scans/${scanId}/points?format=csv`, { cookie });
    const [header, ...rows] = csvRows(csv.body.toString('utf8'));
    expect(header.join(',')).toBe(CSV_HEADER);
    expect(rows).toHaveLength(TOTAL);
    expect(rows[0].join(',')).toBe('0,1,50,failed,no_inflation_end,,,,,,,,,');
    expect(rows[1].join(',')).toMatch(/^1,1,50\.204\d*,ok,,0\.9500\d*,0\.01,,2\.1e-9,,,,,$/);

    const arrow = await rawGet(t, `/api/scans/${scanId}/points?format=arrow`, { cookie });
    expect(arrow.status).toBe(200);
    expect(arrow.headers['content-type']).toBe('application/vnd.apache.arrow.stream');
    expect(arrow.headers['content-disposition']).toBe(`attachment; filename="scan-${scanId}-points.arrow"`);
    const table = tableFromIPC(arrow.body);
    expect(table.schema.fields.map((f) => f.name)).toEqual(header);
    expect(table.numRows).toBe(TOTAL);
    // Every cell equal: numbers as the CSV writes them, empty where the Arrow value is null.
    const columns = header.map((name) => table.getChild(name)!);
    rows.forEach((row, i) => {
      const fromArrow = columns.map((column) => {
        const value = column.get(i) as number | string | null;
        return value === null ? '' : String(value);
      });
      expect(fromArrow).toEqual(row);
    });
    expect(Array.from(table.getChild('status')!).filter((s) => s === 'failed')).toHaveLength(FAILED);
    expect(table.getChild('ns')!.nullCount).toBe(FAILED);
  });

  it('exports only the filtered points, in the asked order, in every format', async () => {
    // p = 1 + k/10 ≤ 1.25: rows k = 0, 1, 2 of the grid; of those only the ok points with n_s ≥ 0.9502.
    const filter = 'input.p_max=1.25&status=ok&ns_min=0.9502&sort=ns&order=desc';
    const expected: number[] = [];
    for (let i = 3 * N_COUNT - 1; i >= 0; i--) if (i % 7 !== 0 && 0.95 + i * 1e-5 >= 0.9502) expected.push(i);
    expect(expected.length).toBeGreaterThan(50);

    const csv = csvRows((await rawGet(t, `/api/scans/${scanId}/points?format=csv&${filter}`, { cookie })).body.toString('utf8'));
    expect(csv.slice(1).map((row) => Number(row[0]))).toEqual(expected);
    const json = JSON.parse((await rawGet(t, `/api/scans/${scanId}/points?format=json&${filter}`, { cookie })).body.toString('utf8')) as { pointIndex: number }[];
    expect(json.map((p) => p.pointIndex)).toEqual(expected);
    const arrow = tableFromIPC((await rawGet(t, `/api/scans/${scanId}/points?format=arrow&${filter}`, { cookie })).body);
    expect(Array.from(arrow.getChild('pointIndex')!.toArray() as Int32Array)).toEqual(expected);
  });

  it('sends an Arrow stream with the columns and no row when nothing matches', async () => {
    const arrow = await rawGet(t, `/api/scans/${scanId}/points?format=arrow&ns_min=5`, { cookie });
    expect(arrow.status).toBe(200);
    const table = tableFromIPC(arrow.body);
    expect(table.numRows).toBe(0);
    expect(table.schema.fields.map((f) => f.name).join(',')).toBe(CSV_HEADER);
  });

  it('refuses an unknown format with a message naming the field', async () => {
    const res = await rawGet(t, `/api/scans/${scanId}/points?format=parquet`, { cookie });
    expect(res.status).toBe(400);
    expect(JSON.parse(res.body.toString('utf8')).message).toMatch(/format/);
  });
});
