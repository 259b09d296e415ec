import { spawn } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { readDatabaseConfig } from '../../src/config/database.config';
import { buildDataSourceOptions } from '../../src/database/typeorm-options';
import { DEMO_PASSWORD } from '../../src/database/seeds/demo-scenario';

export interface TestApp {
  url: string;
  /** Routes the API mapped at boot, as "GET /api/groups/:id". */
  routes: string[];
  db: DataSource;
  http: () => ReturnType<typeof request>;
  agent: () => ReturnType<typeof request.agent>;
  signIn: (email: string, password?: string) => Promise<ReturnType<typeof request.agent>>;
  close: () => Promise<void>;
}

/** A TCP port nothing listens on right now, on 127.0.0.1. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

export interface TestAppPlace {
  /** Network namespace to run the API in (`ip netns exec`), standing in for another machine. */
  netns?: string;
  /** Address the API listens on and is reached at (default 127.0.0.1). */
  host?: string;
}

/**
 * Starts the built API (`dist/main.js`, exactly what production runs) as its own process
 * against the test MariaDB and Redis that `npm test` started, with `env` overriding settings.
 * A separate process rather than an in-process Nest app, because on Node 20 jest cannot load
 * the CommonJS @nestjs/throttler next to the ES-module-only Nest 12 packages.
 */
export async function createTestApp(env: Record<string, string> = {}, place: TestAppPlace = {}): Promise<TestApp> {
  const appEnv = { ...process.env, ...env };
  if (!appEnv.DATABASE_URL?.includes('test')) {
    throw new Error('DATABASE_URL must point at the test database; run the suites through `npm test`');
  }
  const host = place.host ?? '127.0.0.1';
  // A fresh namespace has nothing listening, so any port there is free.
  const port = place.netns ? 3000 : await freePort();
  const node = [process.execPath, path.resolve('dist/main.js')];
  // `ip netns exec` replaces itself with node, so the child's pid is the API's.
  const [command, ...args] = place.netns ? ['ip', 'netns', 'exec', place.netns, ...node] : node;
  const child = spawn(command, args, {
    // An API reached at another address answers for that name (the Host check), as a real one would.
    env: { ...appEnv, API_PORT: String(port), API_HOST: host, NO_COLOR: '1', ...(place.host ? { APP_URL: `http://${host}:${port}/` } : {}) },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout!.on('data', (d: Buffer) => (output += d.toString()));
  child.stderr!.on('data', (d: Buffer) => (output += d.toString()));
  const url = `http://${host}:${port}`;
  const deadline = Date.now() + 30_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`the API exited with ${child.exitCode}:\n${output}`);
    const healthy = await fetch(`${url}/api/health`).then((r) => r.ok, () => false);
    if (healthy) break;
    if (Date.now() > deadline) throw new Error(`the API did not answer within 30 s:\n${output}`);
    await new Promise((r) => setTimeout(r, 150));
  }
  const routes = [...output.matchAll(/Mapped \{([^,]+), (\w+)\} route/g)].map((m) => `${m[2]} ${m[1]}`);
  const db = new DataSource(buildDataSourceOptions(readDatabaseConfig(appEnv)));
  await db.initialize();
  const agent = () => request.agent(url);
  return {
    url,
    routes,
    db,
    http: () => request(url),
    agent,
    async signIn(email, password = DEMO_PASSWORD) {
      const a = agent();
      const res = await a.post('/api/auth/login').send({ email, password });
      if (res.status !== 200) throw new Error(`sign-in of ${email} answered ${res.status}: ${JSON.stringify(res.body)}`);
      return a;
    },
    async close() {
      await db.destroy();
      // A 5xx is logged with its stack, which a test's failed assertion cannot show.
      const failures = unexpectedErrors(output);
      if (failures) process.stderr.write(`the API answered with server errors (5xx), logged as:\n${failures}\n`);
      if (child.exitCode !== null) return;
      await new Promise<void>((resolve) => {
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
      });
    },
  };
}

/** The API's ERROR log entries of 5xx answers (with their stacks), empty when there were none. */
function unexpectedErrors(output: string): string {
  const entries = output.split(/\n(?=\[Nest\])/);
  return entries.filter((entry) => /\bERROR \[ApiExceptionFilter\]/.test(entry)).join('\n');
}

export const DEMO = {
  admin: 'amara.okafor@halvorsen.example',
  plateauLead: 'henrik.solberg@halvorsen.example',
  plateauMember: 'lucia.marin@halvorsen.example',
  plateauViewer: 'tomas.reyes@halvorsen.example',
  tensorLead: 'mei.nakamura@halvorsen.example',
  tensorMember: 'jonas.weber@halvorsen.example',
  tensorViewer: 'priya.raman@halvorsen.example',
} as const;
