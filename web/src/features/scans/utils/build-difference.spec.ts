import { buildDifference } from './build-difference';

const build = (engineVersion: string, commit: string) => ({ engineVersion, commit, node: 'v20.20.2' });

describe('buildDifference', () => {
  it('is silent when engine and commit agree, whatever Node', () => {
    expect(buildDifference(build('0.1.0', 'a'.repeat(40)), { ...build('0.1.0', 'a'.repeat(40)), node: 'v22.1.0' })).toBeNull();
  });

  it('names the version and the commit that changed', () => {
    const text = buildDifference(build('0.1.0', 'a'.repeat(40)), build('0.2.0', 'b'.repeat(40)));
    expect(text).toContain('engine 0.2.0 (the scan\'s: 0.1.0)');
    expect(text).toContain(`commit ${'b'.repeat(12)} (the scan's: ${'a'.repeat(12)})`);
  });

  it('says so when the scan recorded no build', () => {
    expect(buildDifference(null, build('0.1.0', 'unknown'))).toMatch(/was not recorded/);
  });
});
