import { zodResolver } from '@hookform/resolvers/zod';
import { createScanSchema, type CreateScan, type ScanModel } from '@sixtyfold/shared';
import { set, type FieldErrors, type Resolver } from 'react-hook-form';
import type { PointsFileRead } from '../../utils/read-points-file';

/**
 * The form edits a scan in the shape of `createScanSchema`, with the same field names, so the
 * schema's error paths and the API's `fieldErrors` land on the right inputs unchanged. Three
 * fields hold text while being edited and become the schema's values in `toScanInput`:
 * `tags` (comma separated), `model` ("family:<key>" or "group:<id>") and a list axis' `values`.
 */
export interface ScanFormValues {
  groupId: number | undefined;
  name: string;
  tags: string;
  note: string;
  model: string;
  params: Record<string, number | undefined>;
  phiInit: number | undefined;
  /** Where the points come from: the grid of `axes`, or a points file (read outside the form, see ScanFormContext). */
  points: 'grid' | 'file';
  /** The chosen file's name; its problems are reported on this field. */
  pointsFile: string;
  axes: AxisDraft[];
  /** Every pivot value at once, so switching between fixed and reheating loses nothing. */
  pivot: { kind: 'fixed' | 'reheating'; nStar: number | undefined; w: number | undefined; energyGeV: number | undefined };
  method: CreateScan['method'];
  tolerance: number | undefined;
}

/** One axis with both kinds' fields, so switching between range and list loses nothing. */
export interface AxisDraft {
  parameter: string;
  kind: 'range' | 'list';
  min: number | undefined;
  max: number | undefined;
  count: number | undefined;
  spacing: 'linear' | 'log';
  /** The pasted list, as typed. */
  values: string;
}

export const MAX_AXES = 4;

export const familyModelKey = (family: string) => `family:${family}`;
export const groupModelKey = (modelId: number) => `group:${modelId}`;

export function decodeModel(key: string): ScanModel | undefined {
  const [kind, value] = key.split(':');
  if (kind === 'family' && value) return { kind: 'family', family: value };
  if (kind === 'group' && Number(value) > 0) return { kind: 'group', modelId: Number(value) };
  return undefined;
}

/** Points of the grid the axes describe, or null while an axis has no length yet. */
export function countPoints(axes: AxisDraft[]): number | null {
  let total = 1;
  for (const axis of axes) {
    const length = axis.kind === 'range' ? axis.count : parseNumberList(axis.values).values.length;
    if (!length || !Number.isInteger(length) || length < 1) return null;
    total *= length;
  }
  return total;
}

/** What a number input gives: a number, or undefined when empty so the schema's own message shows. */
export function toNumber(value: unknown): number | undefined {
  if (typeof value === 'number') return Number.isFinite(value) ? value : undefined;
  if (typeof value !== 'string' || value.trim() === '') return undefined;
  const n = Number(value);
  return Number.isFinite(n) ? n : undefined;
}

/** Numbers separated by commas, spaces or newlines; the tokens that are not numbers, by name. */
export function parseNumberList(text: string): { values: number[]; bad: string[] } {
  const values: number[] = [];
  const bad: string[] = [];
  for (const token of text.split(/[\s,]+/).filter(Boolean)) {
    const n = Number(token);
    if (Number.isFinite(n)) values.push(n);
    else bad.push(token);
  }
  return { values, bad };
}

function badTokensMessage(bad: string[]): string {
  const quoted = bad.slice(0, 3).map((t) => `“${t}”`);
  if (bad.length === 1) return `${quoted[0]} is not a number`;
  const more = bad.length > 3 ? ` and ${bad.length - 3} more` : '';
  return `${quoted.join(', ')}${more} are not numbers`;
}

/** What the form holds besides its values: the points file as read (large, and not edited here). */
export interface ScanFormContext {
  pointsFile: PointsFileRead | null;
}

/** The columns of a points file that was read, else none. */
export const fileColumns = (file: PointsFileRead | null): string[] => (file?.ok ? file.pointList.columns : []);

/**
 * The body `POST /api/scans` would receive, before the schema checks it, and the problems only
 * the form can see (words in a pasted list, a points file that does not read), by field path.
 */
export function toScanInput(values: ScanFormValues, pointsFile: PointsFileRead | null = null): { input: unknown; problems: Record<string, string> } {
  const problems: Record<string, string> = {};
  const fromFile = values.points === 'file';
  if (fromFile && !pointsFile) problems.pointsFile = 'choose a points file';
  if (fromFile && pointsFile && !pointsFile.ok) problems.pointsFile = pointsFile.message;
  const pointList = fromFile && pointsFile?.ok ? pointsFile.pointList : undefined;
  const axes = fromFile ? undefined : values.axes.map((axis, i) => {
    if (axis.kind === 'range') {
      const { parameter, kind, min, max, count, spacing } = axis;
      return { parameter, kind, min, max, count, spacing };
    }
    const { values: numbers, bad } = parseNumberList(axis.values);
    if (bad.length) problems[`axes.${i}.values`] = badTokensMessage(bad);
    return { parameter: axis.parameter, kind: axis.kind, values: numbers };
  });
  // A quantity on an axis is not fixed as well: its fixed field is hidden meanwhile, and a value it
  // kept from before (the form library keeps the values of unmounted inputs) must not be sent.
  const onAxis = new Set(fromFile ? fileColumns(pointsFile) : values.axes.map((axis) => axis.parameter));
  const unlessOnAxis = <T,>(name: string, value: T) => (onAxis.has(name) ? undefined : value);
  const { kind } = values.pivot;
  const nStar = unlessOnAxis('nStar', values.pivot.nStar);
  const w = unlessOnAxis('reheatingW', values.pivot.w);
  const energyGeV = unlessOnAxis('reheatingEnergyGeV', values.pivot.energyGeV);
  const params = Object.fromEntries(Object.entries(values.params).filter(([name]) => !onAxis.has(name)));
  const input = {
    groupId: values.groupId,
    name: values.name,
    tags: values.tags.split(',').map((t) => t.trim()).filter(Boolean),
    note: values.note,
    model: decodeModel(values.model),
    params,
    phiInit: values.phiInit,
    axes,
    pointList,
    pivot: kind === 'fixed' ? { kind, nStar } : { kind, w, energyGeV },
    method: values.method,
    tolerance: values.tolerance,
  };
  return { input, problems };
}

const schemaResolver = zodResolver(createScanSchema);

/** Validates with `createScanSchema`, the schema the API uses, after `toScanInput`. */
export const scanFormResolver: Resolver<ScanFormValues, ScanFormContext, CreateScan> = async (values, context, options) => {
  const { input, problems } = toScanInput(values, context?.pointsFile ?? null);
  const result = await schemaResolver(input as never, context, options as never);
  const { pointList, ...rest } = result.errors as FieldErrors<ScanFormValues> & { pointList?: unknown };
  const errors = rest as FieldErrors<ScanFormValues>;
  // The list's problems (a column also fixed, N_* twice) concern the file: shown beside it.
  const listProblem = firstMessage(pointList);
  if (listProblem && !problems.pointsFile) problems.pointsFile = listProblem;
  for (const [path, message] of Object.entries(problems)) set(errors, path, { type: 'custom', message });
  if (Object.keys(errors).length > 0) return { values: {}, errors };
  return { values: result.values as CreateScan, errors: {} };
};

/** The first message under a field's errors, for fields the schema checks item by item (tags, a list). */
export function firstMessage(error: unknown): string | undefined {
  if (!error || typeof error !== 'object') return undefined;
  const { message } = error as { message?: unknown };
  if (typeof message === 'string' && message) return message;
  for (const [key, child] of Object.entries(error)) {
    if (key === 'ref') continue;
    const found = firstMessage(child);
    if (found) return found;
  }
  return undefined;
}
