import { describe, expect, it, vi } from 'vitest';
import { MAX_POTENTIAL_LENGTH, parsePotential } from '../engine/expression/index.js';
import { math } from '../engine/expression/mathjs-instance.js';
import { checkPotentialExpression, modelInputSchema, modelUpdateSchema } from './potential-model.schema.js';

const plateau = {
  groupId: 3,
  name: '  Plateau  ',
  expression: 'V0 * (1 - exp(-sqrt(2 / (3 * alpha)) * phi))^2',
  parameters: [
    { name: 'V0', defaultValue: 1e-10, min: 1e-14, max: 1e-8 },
    { name: 'alpha', defaultValue: 1, min: 0.1, max: 10, description: 'curvature' },
  ],
  phiInit: 7.5,
};

/** Issues of a failed parse as "path: message", in order. */
function issuesOf(result: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }): string[] {
  expect(result.success).toBe(false);
  return result.error!.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
}

describe('checkPotentialExpression', () => {
  it('accepts an expression and names the parameters it uses, in declared order', () => {
    expect(checkPotentialExpression('alpha * phi^2 + V0', ['V0', 'alpha', 'unused'])).toEqual({ ok: true, usedParameters: ['V0', 'alpha'] });
    expect(checkPotentialExpression('phi^4', [])).toEqual({ ok: true, usedParameters: [] });
  });

  it('leads with the 1-based character and keeps the 0-based index and length', () => {
    const check = checkPotentialExpression('V0 * (1 + sinn(phi))', ['V0']);
    expect(check).toMatchObject({ ok: false, index: 10, length: 4 });
    if (check.ok) return;
    expect(check.message).toMatch(/^at character 11: unsupported function 'sinn': use one of sqrt, exp, log/);
    // The position is said once, not again inside the engine's sentence.
    expect(check.message.match(/character/g)).toHaveLength(1);
  });

  it('says which names may be used for an unknown symbol', () => {
    expect(checkPotentialExpression('lamda * phi^4', ['lambda'])).toEqual({
      ok: false,
      message: "at character 1: unknown symbol 'lamda': use phi or one of the parameters lambda (did you mean 'lambda'?)",
      index: 0,
      length: 5,
    });
  });

  it('places syntax errors, also one at the end of the text', () => {
    expect(checkPotentialExpression('phi @ 2', [])).toEqual({ ok: false, message: 'at character 5: syntax error: unexpected "@ 2"', index: 4, length: 3 });
    expect(checkPotentialExpression('2 * (phi + 1', [])).toEqual({
      ok: false,
      message: 'at the end of the expression: syntax error: parenthesis ) expected',
      index: 12,
      length: 0,
    });
  });

  it('gives the same answer again, and a copy a caller may change', () => {
    const first = checkPotentialExpression('V0 * phi^2', ['V0']);
    expect(first).toEqual({ ok: true, usedParameters: ['V0'] });
    if (first.ok) first.usedParameters.push('changed by the caller');
    expect(checkPotentialExpression('V0 * phi^2', ['V0'])).toEqual({ ok: true, usedParameters: ['V0'] });
    // Other names are another question.
    expect(checkPotentialExpression('V0 * phi^2', ['W0'])).toMatchObject({ ok: false, index: 0, length: 2 });
  });

  it('passes on problems that have no position as they are', () => {
    expect(checkPotentialExpression('V0 * 2', ['V0'])).toEqual({
      ok: false,
      message: 'The expression does not depend on phi: V must be a function of the field phi',
    });
  });
});

describe('checkPotentialExpression: cost', () => {
  // Simplifying the third derivative of this short expression took about 3 s, longer than any answer may take.
  const slowToSimplify = 'a * cos(phi) / log(0.01039 * phi)';

  it('checks an expression without simplifying its derivatives; the engine still simplifies them', () => {
    const simplify = vi.spyOn(math, 'simplify');
    try {
      expect(checkPotentialExpression(slowToSimplify, ['a'])).toEqual({ ok: true, usedParameters: ['a'] });
      expect(simplify).not.toHaveBeenCalled();
      expect(parsePotential(slowToSimplify, ['a']).ok).toBe(true);
      expect(simplify).toHaveBeenCalled();
    } finally {
      simplify.mockRestore();
    }
  });
});

describe('modelInputSchema', () => {
  it('accepts a model, trims the name and fills in the descriptions', () => {
    const model = modelInputSchema.parse(plateau);
    expect(model.name).toBe('Plateau');
    expect(model.description).toBe('');
    expect(model.parameters.map((p) => [p.name, p.description])).toEqual([['V0', ''], ['alpha', 'curvature']]);
  });

  it('refuses an expression the engine cannot read, at the expression, with the position', () => {
    const issues = issuesOf(modelInputSchema.safeParse({ ...plateau, expression: 'V0 * sinn(phi) + alpha' }));
    expect(issues).toEqual([`expression: ${(checkPotentialExpression('V0 * sinn(phi) + alpha', ['V0', 'alpha']) as { message: string }).message}`]);
    expect(issues[0]).toMatch(/^expression: at character 6: unsupported function 'sinn'/);
  });

  it('refuses an expression that uses a parameter the model does not declare', () => {
    const issues = issuesOf(modelInputSchema.safeParse({ ...plateau, parameters: [plateau.parameters[0]] }));
    expect(issues).toEqual(["expression: at character 30: unknown symbol 'alpha': use phi or one of the parameters V0"]);
  });

  it('requires the group, a name, the expression, the parameters and φ_init', () => {
    expect(issuesOf(modelInputSchema.safeParse({}))).toEqual([
      'groupId: choose the group',
      'name: give the model a name',
      'expression: write V in terms of phi',
      'parameters: list the parameters (an empty list when V has none)',
      'phiInit: give φ_init, the field value where inflation starts (M_pl = 1)',
    ]);
    expect(issuesOf(modelInputSchema.safeParse({ ...plateau, name: '   ' }))).toEqual(['name: give the model a name']);
    expect(issuesOf(modelInputSchema.safeParse({ ...plateau, phiInit: Infinity }))).toHaveLength(1);
  });

  it('names each duplicate parameter, and refuses phi and reserved words as names', () => {
    const issues = issuesOf(modelInputSchema.safeParse({
      ...plateau,
      parameters: [...plateau.parameters, { name: 'V0', defaultValue: 1 }, { name: 'phi', defaultValue: 1 }, { name: 'sin', defaultValue: 1 }],
    }));
    expect(issues).toEqual([
      'parameters.2.name: there is already a parameter named V0',
      'parameters.3.name: phi is the field; give the parameter another name',
      expect.stringMatching(/^parameters\.4\.name: Parameter name 'sin' is reserved/),
    ]);
  });

  it('applies the cross-field rules also while another field is missing', () => {
    const { phiInit: _, ...noStart } = plateau;
    expect(issuesOf(modelInputSchema.safeParse({ ...noStart, parameters: [...plateau.parameters, { name: 'alpha', defaultValue: 1 }] }))).toEqual([
      'phiInit: give φ_init, the field value where inflation starts (M_pl = 1)',
      'parameters.2.name: there is already a parameter named alpha',
    ]);
    expect(issuesOf(modelInputSchema.safeParse({ ...noStart, expression: 'V0 * alpha * phi^^2' }))).toEqual([
      'phiInit: give φ_init, the field value where inflation starts (M_pl = 1)',
      'expression: at character 18: syntax error: value expected',
    ]);
    // Parameters of the wrong shape are the field's problem; the expression is not read against them.
    expect(issuesOf(modelInputSchema.safeParse({ ...plateau, parameters: [{ name: 3 }, null] })).every((i) => i.startsWith('parameters.'))).toBe(true);
    expect(issuesOf(modelInputSchema.safeParse(null))).toHaveLength(1);
  });

  it('wants min below max and the default inside [min, max]', () => {
    const issues = issuesOf(modelInputSchema.safeParse({
      ...plateau,
      parameters: [
        { name: 'V0', defaultValue: 1e-10, min: 1e-8, max: 1e-8 },
        { name: 'alpha', defaultValue: 20, min: 0.1, max: 10 },
      ],
    }));
    expect(issues).toEqual([
      'parameters.0.max: max must be above min (1e-8)',
      'parameters.0.defaultValue: the default must be at least min (1e-8)',
      'parameters.1.defaultValue: the default must be at most max (10)',
    ]);
    // Only one bound given: the default is checked against that one.
    expect(modelInputSchema.safeParse({ ...plateau, parameters: [{ name: 'V0', defaultValue: -1, min: 0 }, plateau.parameters[1]] }).success).toBe(false);
    expect(modelInputSchema.safeParse({ ...plateau, parameters: [{ name: 'V0', defaultValue: 5, min: 0 }, plateau.parameters[1]] }).success).toBe(true);
  });

  it('keeps to the limits: 12 parameters, the expression length, 2000 characters of description', () => {
    const many = Array.from({ length: 13 }, (_, i) => ({ name: `p${i}`, defaultValue: 1 }));
    expect(issuesOf(modelInputSchema.safeParse({ ...plateau, expression: 'p0 * phi', parameters: many }))).toEqual(['parameters: a model has at most 12 parameters']);
    const long = `phi${' + phi'.repeat(MAX_POTENTIAL_LENGTH / 6)}`;
    expect(long.length).toBeGreaterThan(MAX_POTENTIAL_LENGTH);
    expect(issuesOf(modelInputSchema.safeParse({ ...plateau, expression: long }))).toEqual([`expression: the expression has at most ${MAX_POTENTIAL_LENGTH} characters`]);
    expect(issuesOf(modelInputSchema.safeParse({ ...plateau, description: 'x'.repeat(2001) }))).toEqual(['description: the description has at most 2000 characters']);
  });
});

describe('modelUpdateSchema', () => {
  it('takes any subset of the fields and has no group', () => {
    expect(modelUpdateSchema.parse({})).toEqual({});
    expect(modelUpdateSchema.parse({ name: ' New name ', groupId: 9 })).toEqual({ name: 'New name' });
  });

  it('checks the same rules on what is given', () => {
    expect(issuesOf(modelUpdateSchema.safeParse({ expression: 'phi^^2', parameters: [] }))).toEqual(['expression: at character 5: syntax error: value expected']);
    expect(issuesOf(modelUpdateSchema.safeParse({ parameters: [{ name: 'a', defaultValue: 1 }, { name: 'a', defaultValue: 2 }] }))).toEqual([
      'parameters.1.name: there is already a parameter named a',
    ]);
    expect(issuesOf(modelUpdateSchema.safeParse({ phiInit: null }))).toHaveLength(1);
  });
});
