// The `npm run evaluate` contract: JSON in on standard input, JSON out, nothing else on stdout.
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const script = path.join(path.dirname(fileURLToPath(import.meta.url)), 'evaluate.mjs');
const run = (input) => spawnSync(process.execPath, [script], { input, encoding: 'utf8' });

describe('evaluate command', () => {
  it('answers one object with one object and an array with an array', () => {
    const one = run(JSON.stringify({ potential: 'starobinsky', nStar: 55, method: 'slowroll' }));
    expect(one.status).toBe(0);
    const result = JSON.parse(one.stdout);
    expect(result).toMatchObject({ status: 'ok', message: '', nStar: 55 });
    for (const key of ['ns', 'r', 'alphaS', 'As', 'amplitudeScale', 'nTotal', 'phiStar', 'phiEnd', 'energyScaleGeV']) {
      expect(Number.isFinite(result[key])).toBe(true);
    }
    const many = run(JSON.stringify([
      { potential: '0.5*m^2*phi^2', params: { m: 6e-6 }, phiInit: 16, nStar: 60, method: 'exact' },
      { potential: 'power-law', nStar: 60 },
      { potential: 'monomial', nStar: 'sixty' },
    ]));
    expect(many.status).toBe(0);
    const results = JSON.parse(many.stdout);
    expect(results.map((r) => r.status)).toEqual(['ok', 'no_end', 'invalid_input']);
    expect(results[2].message).toMatch(/nStar/);
    expect(results[1].ns).toBeNull();
  });

  it('returns the trajectory and the spectrum when asked', () => {
    const out = run(JSON.stringify({ potential: 'starobinsky', nStar: 55, method: 'exact', trajectory: true, spectrum: true }));
    const result = JSON.parse(out.stdout);
    const { N, epsilonH } = result.trajectory;
    expect(N.every((n, i) => i === 0 || n > N[i - 1])).toBe(true);
    expect(epsilonH.at(-1)).toBeCloseTo(1, 10);
    expect(N.at(-1)).toBeCloseTo(result.nTotal, 10);
    const { lnK, scalar, tensor } = result.spectrum;
    const pivot = lnK.indexOf(0);
    expect(scalar[pivot] / result.As).toBeCloseTo(1, 6);
    expect(tensor[pivot] / scalar[pivot]).toBeCloseTo(result.r, 6);
    // A red tilt: P_R falls with k.
    expect(scalar[0]).toBeGreaterThan(scalar.at(-1));
  });

  it('reports input that is not JSON on standard error with exit code 2', () => {
    const bad = run('{ not json');
    expect(bad.status).toBe(2);
    expect(bad.stdout).toBe('');
    expect(bad.stderr).toMatch(/not JSON/);
  });
});
