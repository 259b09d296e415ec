import {
  createScanSchema, findFamily, PIVOT_AXES, POTENTIAL_FAMILIES, type CreateScan, type ModelParameter, type PivotAxis, type PointList,
  type PotentialModel,
} from '@sixtyfold/shared';
import { decodeModel, familyModelKey, groupModelKey, type AxisDraft, type ScanFormValues } from './scan-form-values';

// How the form's values start (blank, or a copy of a stored scan) and what one edit implies for the
// rest: a model's parameters, the axes, the fixed values. All pure, on ScanFormValues.

/** Which pivot value each pivot axis replaces. */
export const PIVOT_FIELDS: Record<PivotAxis, 'nStar' | 'w' | 'energyGeV'> = { nStar: 'nStar', reheatingW: 'w', reheatingEnergyGeV: 'energyGeV' };

/** What the axis menu calls the pivot quantities, and the range a new axis over them starts with. */
export const PIVOT_AXIS_INFO: Record<PivotAxis, { label: string; axis: Pick<AxisDraft, 'min' | 'max' | 'spacing'> }> = {
  nStar: { label: 'N_* (needs a fixed pivot)', axis: { min: 50, max: 60, spacing: 'linear' } },
  reheatingW: { label: 'w_reh (needs N_* from reheating)', axis: { min: -0.3, max: 1, spacing: 'linear' } },
  reheatingEnergyGeV: { label: 'ρ_reh^1/4 in GeV (needs N_* from reheating)', axis: { min: 1e4, max: 1e15, spacing: 'log' } },
};

// Usual starting values: N_* in the commonly quoted 50–60 window, matter-like reheating, a mid-range scale.
export const PIVOT_DEFAULTS = { nStar: 55, w: 0, energyGeV: 1e10 } as const;

const DEFAULT_COUNT = 10;
export const DEFAULT_FAMILY = POTENTIAL_FAMILIES[0].key;

/** The parameters, the source the engine evaluates, and the start φ of the chosen model. */
export interface ChosenModel {
  parameters: ModelParameter[];
  /** A family's key or a group model's expression, as the API stores in `potentialSource`. */
  source: string;
  phiInit: number | null;
  expression: string;
  reference: string | null;
}

export function chosenModel(key: string, models: PotentialModel[]): ChosenModel | undefined {
  const model = decodeModel(key);
  if (model?.kind === 'family') {
    const family = findFamily(model.family);
    return family && { parameters: family.parameters, source: family.key, phiInit: null, expression: family.expression, reference: family.reference };
  }
  const row = model && models.find((m) => m.id === model.modelId);
  return row && { parameters: row.parameters, source: row.expression, phiInit: row.phiInit, expression: row.expression, reference: null };
}

export const isPivotAxis = (name: string): name is PivotAxis => (PIVOT_AXES as readonly string[]).includes(name);

/** A fresh axis over `parameter`, spanning its suggested range. */
export function axisOver(parameter: string, parameters: ModelParameter[]): AxisDraft {
  const base = { parameter, kind: 'range' as const, count: DEFAULT_COUNT, values: '' };
  if (isPivotAxis(parameter)) return { ...base, ...PIVOT_AXIS_INFO[parameter].axis };
  const p = parameters.find((q) => q.name === parameter);
  if (!p) return { ...base, min: undefined, max: undefined, spacing: 'linear' };
  const spread = Math.abs(p.defaultValue) || 1;
  const min = p.min ?? p.defaultValue - spread / 2;
  const max = p.max ?? p.defaultValue + spread / 2;
  // Ranges over several decades (overall scales, couplings) read best on a log axis.
  const spacing = min > 0 && max / min >= 1e3 ? 'log' : 'linear';
  return { ...base, min, max, spacing };
}

/**
 * The axis "Add axis" creates: over a model parameter no axis varies yet. The families list their
 * overall scale first, so the last free parameter is usually one that changes the predictions.
 */
export function nextAxis(parameters: ModelParameter[], axes: Pick<AxisDraft, 'parameter'>[]): AxisDraft {
  const taken = new Set(axes.map((a) => a.parameter));
  const free = parameters.filter((p) => !taken.has(p.name));
  const parameter = free.at(-1)?.name ?? (taken.has('nStar') ? '' : 'nStar');
  return axisOver(parameter, parameters);
}

/** A new scan in `groupId`: the first family, one axis, N_* = 55, slow-roll. */
export function blankValues(groupId: number | undefined): ScanFormValues {
  const family = findFamily(DEFAULT_FAMILY)!;
  const axes = [nextAxis(family.parameters, [])];
  return {
    groupId,
    name: '',
    tags: '',
    note: '',
    model: familyModelKey(family.key),
    params: fixedParams(family.parameters, axes),
    phiInit: undefined,
    points: 'grid',
    pointsFile: '',
    axes,
    pivot: { kind: 'fixed', ...PIVOT_DEFAULTS },
    method: 'slowroll',
    tolerance: undefined,
  };
}

/** Defaults for every model parameter that no axis varies. */
export function fixedParams(parameters: ModelParameter[], axes: Pick<AxisDraft, 'parameter'>[]): Record<string, number | undefined> {
  const onAxis = new Set(axes.map((a) => a.parameter));
  return Object.fromEntries(parameters.filter((p) => !onAxis.has(p.name)).map((p) => [p.name, p.defaultValue]));
}

/**
 * The fixed values after the axes changed from `before` to `values.axes`. What went onto an axis
 * is no longer fixed (the schema refuses both); what came off gets its default back; the rest
 * keeps what the user typed.
 */
export function syncFixedValues(
  values: Pick<ScanFormValues, 'params' | 'pivot'> & { axes: Pick<AxisDraft, 'parameter'>[] },
  before: string[],
  parameters: ModelParameter[],
): Pick<ScanFormValues, 'params' | 'pivot'> {
  const now = new Set(values.axes.map((a) => a.parameter));
  const params: Record<string, number | undefined> = {};
  for (const p of parameters) {
    if (now.has(p.name)) continue;
    params[p.name] = before.includes(p.name) || !(p.name in values.params) ? p.defaultValue : values.params[p.name];
  }
  const pivot = { ...values.pivot };
  for (const [axis, field] of Object.entries(PIVOT_FIELDS) as [PivotAxis, 'nStar' | 'w' | 'energyGeV'][]) {
    if (now.has(axis)) pivot[field] = undefined;
    else if (before.includes(axis)) pivot[field] = PIVOT_DEFAULTS[field];
  }
  return { params, pivot };
}

/**
 * The values after choosing another model: axes over parameters it lacks move to ones it has,
 * its parameters start from their defaults, and φ_init from the model's own start (families
 * find theirs, so it is left empty for them).
 */
export function withModel(values: ScanFormValues, modelKey: string, models: PotentialModel[]): ScanFormValues {
  const model = chosenModel(modelKey, models);
  const parameters = model?.parameters ?? [];
  const keep = (axis: AxisDraft) => isPivotAxis(axis.parameter) || parameters.some((p) => p.name === axis.parameter);
  const taken = values.axes.filter(keep);
  const axes = values.axes.map((axis) => {
    if (keep(axis)) return axis;
    const replacement = nextAxis(parameters, taken);
    taken.push(replacement);
    return replacement;
  });
  const fixed = syncFixedValues({ params: {}, pivot: values.pivot, axes }, values.axes.map((a) => a.parameter), parameters);
  return { ...values, model: modelKey, axes, ...fixed, phiInit: model?.phiInit ?? undefined };
}

/** The values in another group: a model of the previous group gives way to the first family. */
export function withGroup(values: ScanFormValues, groupId: number, models: PotentialModel[]): ScanFormValues {
  const model = decodeModel(values.model);
  const next = { ...values, groupId };
  const foreign = model?.kind === 'group' && !models.some((m) => m.id === model.modelId && m.groupId === groupId);
  return foreign ? withModel(next, familyModelKey(DEFAULT_FAMILY), models) : next;
}

/** The values after axis `index` took `parameter`, spanning that parameter's suggested range. */
export function withAxisParameter(values: ScanFormValues, index: number, parameter: string, parameters: ModelParameter[]): ScanFormValues {
  const before = values.axes.map((a) => a.parameter);
  const { min, max, spacing } = axisOver(parameter, parameters);
  const axes = values.axes.map((axis, i) => (i === index ? { ...axis, parameter, min, max, spacing } : axis));
  return { ...values, axes, ...syncFixedValues({ ...values, axes }, before, parameters) };
}

/** The name of the points file a copied list scan starts with. */
export const copiedPointsFileName = (scanName: string) => `points of ${scanName}.csv`;

/**
 * A copy of an earlier scan's stored specification, named "Copy of …": the form values and, for a
 * scan over a list, its points; null if it does not read as a scan.
 */
export function copyOfSpec(spec: unknown, name: string): { values: ScanFormValues; pointList?: PointList } | null {
  const parsed = createScanSchema.safeParse(spec);
  if (!parsed.success) return null;
  return { values: valuesOf(parsed.data, name), pointList: parsed.data.pointList };
}

function valuesOf(s: CreateScan, name: string): ScanFormValues {
  return {
    groupId: s.groupId,
    name: `Copy of ${name}`.slice(0, 200),
    tags: s.tags.join(', '),
    note: s.note,
    model: s.model.kind === 'family' ? familyModelKey(s.model.family) : groupModelKey(s.model.modelId),
    params: { ...s.params },
    phiInit: s.phiInit,
    // A copied list comes back as a file of the same points (see ScanForm's initialPoints).
    points: s.pointList ? 'file' : 'grid',
    pointsFile: s.pointList ? copiedPointsFileName(name) : '',
    axes: (s.axes ?? []).map((axis) =>
      axis.kind === 'range'
        ? { parameter: axis.parameter, kind: 'range', min: axis.min, max: axis.max, count: axis.count, spacing: axis.spacing, values: '' }
        : { parameter: axis.parameter, kind: 'list', min: undefined, max: undefined, count: undefined, spacing: 'linear', values: axis.values.join(', ') },
    ),
    pivot:
      s.pivot.kind === 'fixed'
        ? { kind: 'fixed', nStar: s.pivot.nStar, w: PIVOT_DEFAULTS.w, energyGeV: PIVOT_DEFAULTS.energyGeV }
        : { kind: 'reheating', nStar: PIVOT_DEFAULTS.nStar, w: s.pivot.w, energyGeV: s.pivot.energyGeV },
    method: s.method,
    tolerance: s.tolerance,
  };
}
