import { createScanSchema, findFamily, type PotentialModel } from '@sixtyfold/shared';
import { blankValues, syncFixedValues, withAxisParameter, withGroup, withModel } from './scan-form-edits';
import { countPoints, familyModelKey, groupModelKey, parseNumberList, toNumber, toScanInput } from './scan-form-values';

const monomial = findFamily('monomial')!.parameters;

const groupModel: PotentialModel = {
  id: 7,
  groupId: 10,
  name: 'Two-parameter plateau',
  expression: 'V0 * (1 - exp(-phi / mu))^2',
  parameters: [
    { name: 'V0', defaultValue: 1e-10, description: '' },
    { name: 'mu', defaultValue: 2, min: 0.5, max: 20, description: '' },
  ],
  phiInit: 12,
  description: '',
  createdById: null,
  createdAt: '2026-11-01T08:00:00.000Z',
  updatedAt: '2026-11-01T08:00:00.000Z',
};

describe('number fields', () => {
  it('give numbers or undefined, never NaN or strings', () => {
    expect(toNumber('1e-10')).toBe(1e-10);
    expect(toNumber(' 57 ')).toBe(57);
    expect(toNumber('')).toBeUndefined();
    expect(toNumber('abc')).toBeUndefined();
    expect(toNumber(Number.NaN)).toBeUndefined();
  });

  it('read a pasted list separated by commas, spaces or new lines, and name what is not a number', () => {
    expect(parseNumberList('0.5, 1\n2  4,,1e3')).toEqual({ values: [0.5, 1, 2, 4, 1000], bad: [] });
    expect(parseNumberList('1, two, 3x')).toEqual({ values: [1], bad: ['two', '3x'] });
  });
});

describe('the scan the form would submit', () => {
  it('starts as a scan the schema accepts once it has a name', () => {
    const values = { ...blankValues(10), name: 'Monomial powers' };
    const parsed = createScanSchema.parse(toScanInput(values).input);
    expect(parsed).toMatchObject({
      groupId: 10,
      model: { kind: 'family', family: 'monomial' },
      params: { lambda: 1e-10 },
      axes: [{ kind: 'range', parameter: 'p', min: 0.1, max: 6, count: 10, spacing: 'linear' }],
      pivot: { kind: 'fixed', nStar: 55 },
    });
  });

  it('never sends a fixed value for what an axis varies, even if the hidden field kept one', () => {
    const values = { ...blankValues(10), name: 'Over N_*' };
    // As the form library leaves it when the N_* field unmounts under an N_* axis.
    values.pivot = { ...values.pivot, nStar: 55 };
    values.params = { ...values.params, p: 2 };
    values.axes = [
      { ...values.axes[0], parameter: 'p' },
      { ...values.axes[0], parameter: 'nStar', min: 50, max: 60, count: 3 },
    ];
    const input = toScanInput(values).input as { pivot: Record<string, unknown>; params: Record<string, unknown> };
    expect(input.pivot).toEqual({ kind: 'fixed', nStar: undefined });
    expect(input.params).not.toHaveProperty('p');
    expect(createScanSchema.safeParse(input).success).toBe(true);
  });

  it('turns tags and a pasted list into arrays, and reports words in the list by field', () => {
    const values = blankValues(10);
    values.tags = ' plateau, , first try ';
    values.axes[0] = { ...values.axes[0], kind: 'list', values: '1 2 lots' };
    const { input, problems } = toScanInput(values);
    expect(input).toMatchObject({ tags: ['plateau', 'first try'], axes: [{ kind: 'list', parameter: 'p', values: [1, 2] }] });
    expect(problems).toEqual({ 'axes.0.values': '“lots” is not a number' });
  });

  it('counts points only when every axis has a length', () => {
    const axes = blankValues(10).axes;
    expect(countPoints([...axes, { ...axes[0], kind: 'list', values: '1, 2, 3' }])).toBe(30);
    expect(countPoints([{ ...axes[0], count: undefined }])).toBeNull();
  });
});

describe('keeping fixed values in step with the axes', () => {
  it('moves a parameter out of the fixed values when an axis takes it, and back at its default when it leaves', () => {
    const start = blankValues(10);
    const onLambda = withAxisParameter({ ...start, params: { lambda: 3e-10 } }, 0, 'lambda', monomial);
    expect(onLambda.params).toEqual({ p: 2 });
    expect(onLambda.axes[0]).toMatchObject({ parameter: 'lambda', min: 1e-16, max: 1e-4, spacing: 'log' });

    const back = withAxisParameter(onLambda, 0, 'p', monomial);
    expect(back.params).toEqual({ lambda: 1e-10 });
  });

  it('clears N_* while it is on an axis and restores it after', () => {
    const start = blankValues(10);
    const onNStar = withAxisParameter(start, 0, 'nStar', monomial);
    expect(onNStar.pivot.nStar).toBeUndefined();
    expect(onNStar.axes[0]).toMatchObject({ min: 50, max: 60 });
    expect(createScanSchema.safeParse(toScanInput({ ...onNStar, name: 'N_* sweep' }).input).success).toBe(true);

    const off = syncFixedValues({ ...onNStar, axes: [{ ...onNStar.axes[0], parameter: 'p' }] }, ['nStar'], monomial);
    expect(off.pivot.nStar).toBe(55);
    expect(off.params).toEqual({ lambda: 1e-10 });
  });

  it('keeps what the user typed for parameters that stay fixed', () => {
    const values = { ...blankValues(10), params: { lambda: undefined } };
    expect(syncFixedValues(values, ['p'], monomial).params).toEqual({ lambda: undefined });
  });

  it('moves axes to the new model’s parameters and takes its φ_init', () => {
    const values = withModel(blankValues(10), groupModelKey(7), [groupModel]);
    expect(values.axes.map((a) => a.parameter)).toEqual(['mu']);
    expect(values.params).toEqual({ V0: 1e-10 });
    expect(values.phiInit).toBe(12);
    expect(withModel(values, familyModelKey('monomial'), [groupModel]).phiInit).toBeUndefined();
  });

  it('leaves a group model behind when the scan moves to another group', () => {
    const values = withModel(blankValues(10), groupModelKey(7), [groupModel]);
    expect(withGroup(values, 10, [groupModel]).model).toBe(groupModelKey(7));
    const moved = withGroup(values, 11, [groupModel]);
    expect(moved.model).toBe(familyModelKey('monomial'));
    expect(moved.axes.map((a) => a.parameter)).toEqual(['p']);
  });
});

