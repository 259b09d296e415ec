import { defaultRefineSettings, estimateQuery, refineRequest } from './refine-settings';

describe('refine settings', () => {
  it('makes the request and its estimate query from the form, factors per axis', () => {
    const settings = { ...defaultRefineSettings(['alpha', 'nStar']), factors: { alpha: '2', nStar: '1' } };
    const { body } = refineRequest(settings);
    expect(body).toEqual({ boundary: { kind: 'likelihood', likelihood: 'planck18-bk18', level: 95 }, factors: { alpha: 2, nStar: 1 }, depth: 3 });
    expect(estimateQuery(body!)).toEqual({ boundary: 'likelihood', likelihood: 'planck18-bk18', level: 95, 'factor.alpha': 2, 'factor.nStar': 1, depth: 3 });
  });

  it('names the first problem the shared schema finds', () => {
    expect(refineRequest({ ...defaultRefineSettings(['x']), depth: '5' }).problem).toBe('depth: the depth is at most 4');
    expect(refineRequest({ ...defaultRefineSettings(['x']), kind: 'output', value: '' }).problem).toMatch(/^boundary.value: /);
    const output = refineRequest({ ...defaultRefineSettings(['x']), kind: 'output', output: 'r', value: '0.036' });
    expect(estimateQuery(output.body!)).toMatchObject({ boundary: 'output', output: 'r', value: 0.036 });
  });
});
