import { scalePowerText } from './scale-statement';

describe('scalePowerText', () => {
  it('writes whole powers as superscripts and others with a caret', () => {
    expect(scalePowerText({ parameter: 'lambda', power: 1 })).toBe('lambda');
    expect(scalePowerText({ parameter: 'Lambda', power: 4 })).toBe('Lambda⁴');
    expect(scalePowerText({ parameter: 'A', power: -12 })).toBe('A⁻¹²');
    expect(scalePowerText({ parameter: 'A', power: 0.5 })).toBe('A^0.5');
    expect(scalePowerText({ parameter: 'A', power: 1e21 })).toBe('A^1e+21');
  });
});
