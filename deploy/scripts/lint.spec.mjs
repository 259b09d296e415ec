// The lint (eslint.config.mjs) over the whole tree, and proof that its boundaries refuse what they
// should and allow what they should (run by `npm test -- lint`).
import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { ESLint } from 'eslint';
import { ROOT } from './lib/environment.mjs';

const eslint = new ESLint({ cwd: ROOT });

/** Lints one made-up file as if it lived at `filePath`; answers "ruleId: message" per problem. */
async function problems(filePath, code) {
  const [result] = await eslint.lintText(code, { filePath });
  return result.messages.map((m) => `${m.ruleId}: ${m.message}`);
}
const ruleIds = (found) => found.map((p) => p.slice(0, p.indexOf(':')));

describe('lint', () => {
  it('passes on the whole tree', async () => {
    const results = await eslint.lintFiles(['.']);
    const errors = results.reduce((n, r) => n + r.errorCount + r.fatalErrorCount, 0);
    const warnings = results.reduce((n, r) => n + r.warningCount, 0);
    const report = errors + warnings ? await (await eslint.loadFormatter('stylish')).format(results) : '';
    assert.equal(errors + warnings, 0, `ESLint found ${errors} errors and ${warnings} warnings:\n${report}`);
  });
});

describe('lint boundaries', () => {
  const used = 'export const use = [x];\n';

  it('refuses a web feature importing another feature, by alias or by a relative path', async () => {
    const byAlias = await problems('web/src/features/scans/components/example.ts', `import { x } from '@/features/models/api/get-model';\n${used}`);
    assert.deepEqual(ruleIds(byAlias), ['no-restricted-imports']);
    assert.match(byAlias[0], /Features do not import each other/);
    const byPath = await problems('web/src/features/scans/components/example.ts', `import { x } from '../../models/api/get-model';\n${used}`);
    assert.deepEqual(ruleIds(byPath), ['no-restricted-imports']);
    assert.match(byPath[0], /leaves the 'scans' feature/);
  });

  it('allows a feature its own files and shared places, and a route any feature', async () => {
    assert.deepEqual(await problems('web/src/features/scans/components/plane/example.ts',
      `import { x } from '../../utils/grid-cells';\nimport { y } from '@/features/scans/api/get-scan';\nimport { z } from '@/lib/format-number';\nexport const use = [x, y, z];\n`), []);
    assert.deepEqual(await problems('web/src/app/routes/example.tsx',
      `import { x } from '@/features/models/api/get-model';\nimport { y } from '@/features/scans/api/get-scan';\nexport const use = [x, y];\n`), []);
  });

  it('refuses shared web code (lib, components) importing a feature', async () => {
    const found = await problems('web/src/lib/example.ts', `import { x } from '@/features/scans/api/get-scan';\n${used}`);
    assert.deepEqual(ruleIds(found), ['no-restricted-imports']);
    assert.deepEqual(ruleIds(await problems('web/src/components/ui/example.tsx', `import { x } from '../../features/scans/api/get-scan';\n${used}`)), ['no-restricted-imports']);
  });

  it('refuses the worker anything of the API but its database layer', async () => {
    const found = await problems('worker/src/scans/example.ts', `import { x } from '@sixtyfold/api';\n${used}`);
    assert.deepEqual(ruleIds(found), ['no-restricted-imports']);
    assert.match(found[0], /never the HTTP app/);
    assert.deepEqual(ruleIds(await problems('worker/src/scans/example.ts', `import { x } from '@sixtyfold/api/scans/scans.service';\n${used}`)), ['no-restricted-imports']);
    assert.deepEqual(await problems('worker/src/scans/example.ts', `import { x } from '@sixtyfold/api/database';\n${used}`), []);
  });

  it('refuses shared a Node-only module or a framework', async () => {
    for (const source of ['node:fs', 'fs', 'node:crypto', 'path', '@nestjs/common', 'typeorm', 'react', 'ioredis', 'express']) {
      const found = await problems('shared/src/engine/example.ts', `import { x } from '${source}';\n${used}`);
      assert.deepEqual(ruleIds(found), ['no-restricted-imports'], `shared importing ${source}`);
    }
    assert.deepEqual(await problems('shared/src/engine/example.ts', `import { z } from 'zod';\nexport const use = [z];\n`), []);
  });
});
