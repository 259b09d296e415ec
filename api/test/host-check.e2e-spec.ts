import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import { createTestApp, DEMO, type TestApp } from './support/test-app';

const SITE = 'sixtyfold.halvorsen.example';
const INTERNAL = 'sixtyfold.internal.example:8443';

describe('Host and Origin check in production', () => {
  let t: TestApp;
  beforeAll(async () => {
    // As deployed behind the proxy: production (no loopback names), APP_URL and one more name.
    t = await createTestApp({ NODE_ENV: 'production', APP_URL: `https://${SITE}/`, ALLOWED_HOSTS: INTERNAL, TRUST_PROXY: 'true' });
  });
  afterAll(() => t.close());

  const me = (host: string) => t.http().get('/api/auth/me').set('Host', host);

  it('refuses a foreign Host with 421 and a message, also when the page names itself as Origin (DNS rebinding)', async () => {
    const rebound = await t.http().post('/api/auth/login')
      .set('Host', 'evil.example:3060').set('Origin', 'http://evil.example:3060')
      .send({ email: DEMO.plateauMember, password: 'inflaton-demo-1' });
    expect(rebound.status).toBe(421);
    expect(rebound.body).toMatchObject({ statusCode: 421, error: 'Misdirected Request' });
    expect(rebound.body.message).toMatch(/does not answer for "evil.example:3060"/);
    expect(rebound.headers['set-cookie']).toBeUndefined();
    expect((await me('evil.example')).status).toBe(421);
    // Outside /api too: the web app's files are not served for another name.
    expect((await t.http().get('/').set('Host', 'evil.example')).status).toBe(421);
    // In production the loopback names are not the site's either.
    expect((await me('127.0.0.1:3060')).status).toBe(421);
    expect((await me('localhost')).status).toBe(421);
  });

  it('answers the configured names: APP_URL (with or without its default port) and ALLOWED_HOSTS', async () => {
    // 401, not 421: the request reached the routes.
    expect((await me(SITE)).status).toBe(401);
    expect((await me(`${SITE}:443`)).status).toBe(401);
    expect((await me(SITE.toUpperCase())).status).toBe(401);
    expect((await me(INTERNAL)).status).toBe(401);
    expect((await me('sixtyfold.internal.example')).status).toBe(421); // another port than the listed one
    expect((await me(`${SITE}.evil.example`)).status).toBe(421);
  });

  it('behind the trusted proxy, the forwarded Host is the one checked', async () => {
    const forwarded = (host: string) => t.http().get('/api/auth/me').set('X-Forwarded-Host', host);
    expect((await forwarded(SITE)).status).toBe(401);
    expect((await forwarded('evil.example')).status).toBe(421);
  });

  it('refuses a foreign Origin with 403 for any method, and lets the site\'s own pages through', async () => {
    const foreign = await me(SITE).set('Origin', 'http://evil.example:3060');
    expect(foreign.status).toBe(403);
    expect(foreign.body.message).toBe('Requests from pages on http://evil.example:3060 are refused');
    const login = (origin: string) => t.http().post('/api/auth/login').set('Host', SITE).set('Origin', origin)
      .send({ email: DEMO.plateauMember, password: 'inflaton-demo-1' });
    expect((await login('http://evil.example:3060')).status).toBe(403);
    expect((await login(`https://${SITE}`)).status).toBe(200);
  });

  it('answers the health check by any name, for load balancers and start scripts', async () => {
    const health = await t.http().get('/api/health').set('Host', '10.0.0.5:3060');
    expect(health.status).toBe(200);
    expect(health.body.status).toBe('ok');
  });
});

describe('Host check outside production', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ APP_URL: `https://${SITE}/` });
  });
  afterAll(() => t.close());

  it('also answers 127.0.0.1, localhost and [::1] on any port, and nothing else', async () => {
    for (const host of ['127.0.0.1:5173', 'localhost:3060', 'localhost', '[::1]:3060', SITE]) {
      expect({ host, status: (await t.http().get('/api/auth/me').set('Host', host)).status }).toEqual({ host, status: 401 });
    }
    expect((await t.http().get('/api/auth/me').set('Host', 'evil.example:3060')).status).toBe(421);
    // Without TRUST_PROXY a forwarded Host is not believed.
    expect((await t.http().get('/api/auth/me').set('Host', 'evil.example').set('X-Forwarded-Host', SITE)).status).toBe(421);
    expect((await t.http().get('/api/auth/me').set('Origin', 'http://localhost:5173')).status).toBe(401);
    expect((await t.http().get('/api/auth/me').set('Origin', 'http://evil.example')).status).toBe(403);
  });
});
