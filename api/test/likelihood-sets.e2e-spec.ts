import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { AuditEvent } from '../src/audit/entities/audit-event.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';

// Likelihood sets: the built-in ones with their sources, and those a site admin adds, one
// version at a time, never edited, each addition audited.

const KEY = 'test-halvorsen-combined';
const added = (ns: number) => ({
  key: KEY, name: 'Halvorsen combined (test)', statement: 'A Gaussian in n_s and a half-Gaussian in r: an approximation of the published result, not its likelihood.',
  sources: [{ label: 'Planck 2018 X', citation: 'Planck Collaboration 2020, A&A 641, A10', arxiv: '1807.06211' }],
  ns: { mean: ns, sigma: 0.004 }, r: { upper95: 0.036, pivotPerMpc: 0.05 },
});

describe('likelihood sets', () => {
  let t: TestApp;

  beforeAll(async () => {
    t = await createTestApp();
    await t.db.query('DELETE FROM likelihood_sets WHERE set_key = ?', [KEY]);
  });
  afterAll(async () => {
    await t.db.query('DELETE FROM likelihood_sets WHERE set_key = ?', [KEY]);
    await t.close();
  });

  it('lists the built-in sets with their numbers and sources', async () => {
    const member = await t.signIn(DEMO.plateauMember);
    const res = await member.get('/api/likelihood-sets');
    expect(res.status).toBe(200);
    const byKey = new Map(res.body.map((s: { key: string }) => [s.key, s]));
    // n_s = 0.9649 ± 0.0042: Planck 2018 X abstract; r_0.05 < 0.036: BICEP/Keck XIII (arXiv:2110.00483);
    // n_s = 0.974 ± 0.003: Louis et al. 2025 (arXiv:2503.14452), abstract.
    expect(byKey.get('planck18-bk18')).toMatchObject({ builtIn: true, version: 1, ns: { mean: 0.9649, sigma: 0.0042 }, r: { upper95: 0.036 } });
    expect(byKey.get('pact-lb-bk18')).toMatchObject({ builtIn: true, ns: { mean: 0.974, sigma: 0.003 }, r: { upper95: 0.036 } });
    expect(byKey.get('planck18')).toMatchObject({ builtIn: true, ns: { mean: 0.9649 } });
    for (const set of res.body) expect(set.sources.length).toBeGreaterThan(0);
  });

  it('lets a site admin add versions of a set, audited, and reads the latest or the version asked', async () => {
    const admin = await t.signIn(DEMO.admin);
    const first = await admin.post('/api/likelihood-sets').send(added(0.97));
    expect([first.status, first.body.version, first.body.builtIn]).toEqual([201, 1, false]);
    const second = await admin.post('/api/likelihood-sets').send(added(0.972));
    expect([second.status, second.body.version]).toEqual([201, 2]);

    const member = await t.signIn(DEMO.plateauMember);
    expect((await member.get(`/api/likelihood-sets/${KEY}`)).body).toMatchObject({ version: 2, ns: { mean: 0.972 } });
    expect((await member.get(`/api/likelihood-sets/${KEY}?version=1`)).body).toMatchObject({ version: 1, ns: { mean: 0.97 } });
    const missing = await member.get(`/api/likelihood-sets/${KEY}?version=3`);
    expect([missing.status, missing.body.message]).toEqual([404, `Likelihood set '${KEY}' has versions 1, 2, not 3`]);

    const events = await t.db.getRepository(AuditEvent).find({ where: { action: 'likelihood_set.create' }, order: { id: 'DESC' }, take: 2 });
    expect(events.map((e) => e.details)).toEqual([{ key: KEY, version: 2, name: 'Halvorsen combined (test)' }, { key: KEY, version: 1, name: 'Halvorsen combined (test)' }]);
  });

  it('refuses a built-in key, a set without sources, and anyone but a site admin', async () => {
    const admin = await t.signIn(DEMO.admin);
    const builtIn = await admin.post('/api/likelihood-sets').send({ ...added(0.97), key: 'planck18-bk18' });
    expect([builtIn.status, builtIn.body.fieldErrors?.key]).toEqual([409, ["'planck18-bk18' is a built-in set; choose another key"]]);
    const noSources = await admin.post('/api/likelihood-sets').send({ ...added(0.97), sources: [] });
    expect([noSources.status, noSources.body.fieldErrors?.sources]).toEqual([400, ['name at least one source']]);
    const lead = await t.signIn(DEMO.plateauLead);
    expect((await lead.post('/api/likelihood-sets').send(added(0.97))).status).toBe(403);
  });
});
