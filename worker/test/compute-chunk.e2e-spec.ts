import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { ConfigService } from '@nestjs/config';
import { DataSource } from 'typeorm';
import { buildDataSourceOptions, readDatabaseConfig, Scan, ScanPoint, scanLifecycle } from '@sixtyfold/api/database';
import { chunkSize, pointCount, scanChunks, storedScanSpecSchema, type StoredScanSpec } from '@sixtyfold/shared';
import { readWorkerConfig } from '../src/config/worker.config';
import { ComputeChunkService } from '../src/scans/compute-chunk.service';

// The worker's own work, without the API: a chunk computed and stored in the real MariaDB,
// stored again (a retry), refused for a cancelled scan, and given up as failures.

/** Starobinsky slow roll over μ and N_*: 4 × 10 points, milliseconds each. */
const spec = (groupId: number, name: string): StoredScanSpec =>
  storedScanSpecSchema.parse({
    groupId, name, tags: [], note: '', model: { kind: 'family', family: 'starobinsky' }, params: {},
    axes: [
      { kind: 'range', parameter: 'mu', min: 1e-6, max: 1e-4, count: 4, spacing: 'log' },
      { kind: 'range', parameter: 'nStar', min: 50, max: 60, count: 10, spacing: 'linear' },
    ],
    pivot: { kind: 'fixed' }, method: 'slowroll', potentialSource: 'starobinsky',
  });

describe('computing and storing a chunk', () => {
  let db: DataSource;
  let chunks: ComputeChunkService;
  let owner: { groupId: number; ownerId: number };

  beforeAll(async () => {
    db = await new DataSource(buildDataSourceOptions(readDatabaseConfig())).initialize();
    chunks = new ComputeChunkService(db, new ConfigService({ worker: readWorkerConfig({}) }));
    // Any seeded group and one of its members own the test scans.
    const [row]: { group_id: number; user_id: number }[] = await db.query('SELECT group_id, user_id FROM memberships ORDER BY group_id LIMIT 1');
    owner = { groupId: row.group_id, ownerId: row.user_id };
  });
  afterAll(async () => {
    await db.query("DELETE FROM scans WHERE name LIKE 'worker test:%'");
    await db.destroy();
  });

  const submit = async (name: string): Promise<Scan> => {
    const stored = spec(owner.groupId, `worker test: ${name}`);
    return db.transaction((tx) =>
      scanLifecycle.create(tx, { ...owner, modelId: null, family: 'starobinsky', name: stored.name, method: 'slowroll', spec: stored, note: '', totalPoints: pointCount(stored), queuedAt: new Date() }, 'submit', 'member'),
    );
  };
  const reload = (id: number) => db.getRepository(Scan).findOneByOrFail({ id });

  it('stores every point of each chunk once, moves the counters, and finishes the scan with its last chunk', async () => {
    const scan = await submit('two chunks');
    const [first, second] = scanChunks(scan.id, scan.totalPoints, 'slowroll');
    expect(second).toBeDefined();
    expect(first.end - first.start).toBe(chunkSize(scan.totalPoints, 'slowroll'));

    const outcome = await chunks.run(first);
    expect(outcome.computed + outcome.failed).toBe(first.end - first.start);
    let stored = await reload(scan.id);
    expect(stored.status).toBe('running');
    expect(stored.donePoints + stored.failedPoints).toBe(first.end - first.start);

    // The same chunk again (a retry after a lost acknowledgement): rows overwritten, counters unchanged.
    await chunks.run(first);
    expect((await reload(scan.id)).donePoints + (await reload(scan.id)).failedPoints).toBe(first.end - first.start);

    for (const chunk of scanChunks(scan.id, scan.totalPoints, 'slowroll').slice(1)) await chunks.run(chunk);
    stored = await reload(scan.id);
    expect(stored.status).toBe('completed');
    expect(stored.donePoints).toBe(40);
    expect(await db.getRepository(ScanPoint).countBy({ scanId: scan.id })).toBe(40);
  });

  it('writes nothing for a cancelled scan', async () => {
    const scan = await submit('cancelled');
    await scanLifecycle.cancel(db, scan.id, 'queued', 'owner or lead');
    const [first] = scanChunks(scan.id, scan.totalPoints, 'slowroll');
    expect((await chunks.run(first)).skipped).toBe('cancelled');
    expect(await db.getRepository(ScanPoint).countBy({ scanId: scan.id })).toBe(0);
    expect((await reload(scan.id)).status).toBe('cancelled');
  });

  it('stores a given-up chunk as chunk_failed, and a scan of nothing but failures ends failed', async () => {
    const scan = await submit('given up');
    const all = scanChunks(scan.id, scan.totalPoints, 'slowroll');
    for (const chunk of all) {
      expect(await chunks.storeGivenUp(chunk, `the workers could not compute points ${chunk.start}–${chunk.end - 1}: test`)).toBe(chunk.end - chunk.start);
    }
    const stored = await reload(scan.id);
    expect(stored.failedPoints).toBe(40);
    expect(stored.status).toBe('failed');
    const row = await db.getRepository(ScanPoint).findOneByOrFail({ scanId: scan.id, pointIndex: 0 });
    expect(row.status).toBe('chunk_failed');
    expect(row.inputs).toEqual({ mu: 1e-6, nStar: 50 });
  });
});
