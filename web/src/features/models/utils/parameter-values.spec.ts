import type { ModelParameter } from '@sixtyfold/shared';
import { defaultValueTexts, readNumber, readValues } from './parameter-values';

const parameters: ModelParameter[] = [
  { name: 'V0', defaultValue: 1e-10, description: 'plateau height' },
  { name: 'alpha', defaultValue: 1, min: 0.01, max: 100, description: '' },
];

describe('parameter values', () => {
  it('reads numbers as people type them', () => {
    expect(readNumber(' 1e-10 ')).toBe(1e-10);
    expect(readNumber('−0.5')).toBe(-0.5);
    expect(readNumber('')).toBeNull();
    expect(readNumber('1e999')).toBeNull();
    expect(readNumber('two')).toBeNull();
  });

  it('prefills the defaults and reads them back', () => {
    const texts = defaultValueTexts(parameters);
    expect(texts).toEqual({ V0: '1e-10', alpha: '1' });
    expect(readValues(parameters, texts)).toEqual({ ok: true, values: { V0: 1e-10, alpha: 1 } });
  });

  it('names each field that is not a number', () => {
    expect(readValues(parameters, { V0: 'x', alpha: '' })).toEqual({
      ok: false,
      errors: { V0: 'Enter a number for V0, e.g. 1e-10', alpha: 'Enter a number for alpha, e.g. 1' },
    });
  });
});
