// .env.example documents every variable the code reads, and only those (run by `npm test -- lint`).
// The names come from the sources themselves: the keys of the zod schemas in the config factories,
// and every `process.env` read in the API, the worker and the scripts.
import assert from 'node:assert/strict';
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { PROFILES, ROOT } from './lib/environment.mjs';

/** Read by the code but deliberately not in .env.example, each with its reason. */
const NOT_DOCUMENTED = new Map([
  ['PATH', 'the system search path, where the scripts look for mariadbd and redis-server'],
]);

const CONFIG_FILES = ['api/src/config', 'worker/src/config'];
const SOURCE_DIRS = ['api/src', 'worker/src', 'deploy/scripts'];
const NAME = '[A-Z][A-Z0-9_]*';
// The scripts read a profile's settings with its prefix (TEST_DATABASE_URL in tests, plain DATABASE_URL for `npm start`).
const PROFILE_PREFIXES = Object.keys(PROFILES).filter((p) => p !== 'dev').map((p) => `${p.toUpperCase()}_`);

function sourceFiles(dir) {
  return readdirSync(path.join(ROOT, dir), { recursive: true, withFileTypes: true })
    .filter((e) => e.isFile() && /\.(ts|mjs|js)$/.test(e.name) && !/\.(spec|e2e-spec)\.(ts|mjs)$/.test(e.name))
    .map((e) => path.join(e.parentPath, e.name));
}
const matches = (text, regex) => [...text.matchAll(regex)].map((m) => m[1]);

/** Every variable name the code reads, and which of them the scripts read per profile. */
function variablesRead() {
  const read = new Set();
  const perProfile = new Set();
  for (const dir of CONFIG_FILES) {
    for (const file of sourceFiles(dir).filter((f) => f.endsWith('.config.ts'))) {
      // The keys of the config factory's zod object, one per line: `  API_PORT: z.coerce.number()…`.
      for (const name of matches(readFileSync(file, 'utf8'), new RegExp(`^\\s+(${NAME})\\s*:`, 'gm'))) read.add(name);
    }
  }
  for (const dir of SOURCE_DIRS) {
    for (const file of sourceFiles(dir)) {
      const text = readFileSync(file, 'utf8');
      for (const name of matches(text, new RegExp(`process\\.env\\.(${NAME})`, 'g'))) read.add(name);
      for (const name of matches(text, new RegExp(`process\\.env\\[['"\`](${NAME})['"\`]\\]`, 'g'))) read.add(name);
      // environment.mjs: process.env[`${prefix}DATABASE_URL`] and num('SIXTYFOLD_DB_PORT', …), which reads process.env[prefix + key].
      for (const name of [
        ...matches(text, new RegExp(`process\\.env\\[\`\\$\\{prefix\\}(${NAME})\`\\]`, 'g')),
        ...matches(text, new RegExp(`\\bnum\\('(${NAME})'`, 'g')),
      ]) {
        read.add(name);
        perProfile.add(name);
      }
    }
  }
  return { read, perProfile };
}

/** The names .env.example documents, as `# NAME=default` (or set, `NAME=value`). */
function variablesDocumented() {
  const text = readFileSync(path.join(ROOT, '.env.example'), 'utf8');
  return new Set(matches(text, new RegExp(`^#? ?(${NAME})=`, 'gm')));
}

describe('.env.example', () => {
  const { read, perProfile } = variablesRead();
  const documented = variablesDocumented();

  it('finds the variables the code reads (the collection itself works)', () => {
    for (const name of ['DATABASE_URL', 'WORKER_LOCK_SECONDS', 'MAIL_OUTBOX_DIR', 'WORKERS', 'SIXTYFOLD_DB_PORT', 'APP_URL']) {
      assert.ok(read.has(name), `${name} was not found among the variables the code reads`);
    }
    assert.ok(perProfile.has('REDIS_URL'), 'REDIS_URL should be read per profile (TEST_REDIS_URL in tests)');
  });

  it('documents every variable the code reads', () => {
    const missing = [...read].filter((name) => !documented.has(name) && !NOT_DOCUMENTED.has(name)).sort();
    assert.deepEqual(missing, [], `add these to .env.example, each with a comment: ${missing.join(', ')}`);
  });

  it('documents nothing the code does not read', () => {
    const readAs = (name) =>
      read.has(name) || PROFILE_PREFIXES.some((prefix) => name.startsWith(prefix) && perProfile.has(name.slice(prefix.length)));
    const stale = [...documented].filter((name) => !readAs(name)).sort();
    assert.deepEqual(stale, [], `.env.example lists variables no code reads: ${stale.join(', ')}`);
  });

  it('keeps its exceptions honest: each is read by the code and not documented', () => {
    for (const name of NOT_DOCUMENTED.keys()) {
      assert.ok(read.has(name), `${name} is no longer read; remove it from NOT_DOCUMENTED`);
      assert.ok(!documented.has(name), `${name} is documented now; remove it from NOT_DOCUMENTED`);
    }
  });
});
