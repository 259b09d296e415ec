import { describe, expect, it } from 'vitest';
import pkg from '../package.json' with { type: 'json' };
import { ENGINE_VERSION } from '../src/version.js';

describe('ENGINE_VERSION', () => {
  it("is the shared package's version", () => {
    expect(ENGINE_VERSION).toBe(pkg.version);
  });
});
