import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { resolvedEngineOptions } from '@sixtyfold/shared';
import { Group } from '../src/groups/entities/group.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { User } from '../src/users/entities/user.entity';
import { storedSpec } from './support/stored-spec';
import { createTestApp, DEMO, type TestApp } from './support/test-app';

// The citation block: BibTeX for the software that computed a scan, its family's papers, the
// methods papers of its method and the sources of the likelihood the reader picked.

const commit = 'c0ffee0123456789abcdef0123456789abcdef01';
const keysOf = (bib: string) => [...bib.matchAll(/^@\w+\{([^,]+),$/gm)].map((m) => m[1]);

describe('scan citation', () => {
  let t: TestApp;
  let recorded: number;
  let older: number;

  beforeAll(async () => {
    t = await createTestApp();
    const groupId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    const ownerId = (await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauMember })).id;
    const scans = t.db.getRepository(Scan);
    const spec = storedSpec(groupId, { model: { kind: 'family', family: 'quadratic-quartic' }, potentialSource: 'quadratic-quartic', method: 'exact' });
    recorded = (await scans.save({
      groupId, ownerId, family: 'quadratic-quartic', name: 'cited', method: 'exact', status: 'completed', note: '', spec, totalPoints: 4,
      provenance: { engineVersion: '0.1.0', commit, node: 'v20.20.2', specSha256: 'a'.repeat(64), engineOptions: resolvedEngineOptions({ method: 'exact' }) },
    })).id;
    older = (await scans.save({ groupId, ownerId, family: 'natural', name: 'cited, older', method: 'slowroll', status: 'completed', note: '', spec: storedSpec(groupId), totalPoints: 4 })).id;
  });
  afterAll(() => t.close());

  it("cites the software, the family, the method and the picked likelihood's sources, each once", async () => {
    const agent = await t.signIn(DEMO.plateauViewer);
    const res = await agent.get(`/api/scans/${recorded}/citation?likelihood=planck18-bk18`);
    expect(res.status).toBe(200);
    const { keys, bibtex } = res.body as { keys: string[]; bibtex: string };
    // Planck 2018 X is cited by the family and by the set: one entry.
    expect(keys).toEqual(['sixtyfold010', 'linde1983', 'planck2018x', 'baumann2009', 'cashKarp1990', 'planck2018vi', 'mukhanov1992', 'bicepKeck2018']);
    expect(keysOf(bibtex)).toEqual(keys);
    expect(bibtex).toContain(`@software{sixtyfold010,\n  title = {{Sixtyfold: parameter scans of inflationary potentials}},\n  year = {${new Date().getUTCFullYear()}},\n  version = {0.1.0},\n  note = {commit ${commit}}\n}`);
    expect(bibtex).toContain('  eprint = {2110.00483},');

    // Without a likelihood only the scan's own parts; the .bib file as a download.
    const bib = await agent.get(`/api/scans/${recorded}/citation?format=bib`);
    expect(bib.status).toBe(200);
    expect(bib.headers['content-type']).toMatch(/^application\/x-bibtex/);
    expect(bib.headers['content-disposition']).toBe(`attachment; filename="scan-${recorded}.bib"`);
    expect(keysOf(bib.text)).toEqual(['sixtyfold010', 'linde1983', 'planck2018x', 'baumann2009', 'cashKarp1990', 'planck2018vi', 'mukhanov1992']);
  });

  it('never invents a version for a scan stored before provenance was recorded', async () => {
    const agent = await t.signIn(DEMO.plateauMember);
    const res = await agent.get(`/api/scans/${older}/citation`);
    expect(res.body.keys.slice(0, 2)).toEqual(['sixtyfold', 'freese1990']);
    expect(res.body.bibtex).toContain('note = {version and commit not recorded}');
    expect(res.body.bibtex).not.toContain('version = {');
  });

  it('refuses a malformed likelihood or format, naming the field, and an unknown set', async () => {
    const agent = await t.signIn(DEMO.plateauMember);
    const bad = await agent.get(`/api/scans/${recorded}/citation?likelihood=Not%20A%20Set`);
    expect(bad.status).toBe(400);
    expect(bad.body.fieldErrors).toHaveProperty('likelihood');
    const format = await agent.get(`/api/scans/${recorded}/citation?format=pdf`);
    expect(format.status).toBe(400);
    expect(format.body.fieldErrors).toHaveProperty('format');
    expect((await agent.get(`/api/scans/${recorded}/citation?likelihood=no-such-set`)).status).toBe(404);
    const outsider = await t.signIn(DEMO.tensorLead);
    expect((await outsider.get(`/api/scans/${recorded}/citation`)).status).toBe(404);
  });
});
