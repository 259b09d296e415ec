import { BadRequestException } from '@nestjs/common';
import { findFamily, parsePotential, PIVOT_AXES, variedInputs, type CreateScan, type ModelParameter, type StoredScanSpec } from '@sixtyfold/shared';

/**
 * Checks the specification against its model's parameters and completes it: every parameter
 * is fixed or varied (on an axis or a point list's column) (defaults fill the rest), no unknown names, and a start φ exists.
 * The result freezes the model: its expression (`potentialSource`), the parameter values and
 * φ_init are copied in, and workers read only this spec, so editing or deleting the model later
 * leaves a submitted scan as it was.
 */
export function completeSpec(
  spec: CreateScan,
  model: { source: string; parameters: ModelParameter[]; phiInit: number | null; isFamily: boolean; scaleParameter: string | null },
): StoredScanSpec {
  const names = new Set(model.parameters.map((p) => p.name));
  const problems: Record<string, string[]> = {};
  const complain = (field: string, message: string) => (problems[field] ??= []).push(message);
  for (const name of Object.keys(spec.params)) {
    if (!names.has(name)) complain(`params.${name}`, `the model has no parameter ${name}; it has ${[...names].join(', ') || 'none'}`);
  }
  variedInputs(spec).forEach((name, i) => {
    if (!names.has(name) && !(PIVOT_AXES as readonly string[]).includes(name)) {
      complain(spec.pointList ? `pointList.columns.${i}` : `axes.${i}.parameter`, `the model has no parameter ${name}; it has ${[...names].join(', ')}`);
    }
  });
  const params = { ...spec.params };
  const onAxis = new Set(variedInputs(spec));
  for (const p of model.parameters) if (!(p.name in params) && !onAxis.has(p.name)) params[p.name] = p.defaultValue;
  const phiInit = spec.phiInit ?? model.phiInit ?? undefined;
  if (phiInit === undefined && !model.isFamily) complain('phiInit', 'give φ_init: this model does not say where it inflates');
  if (Object.keys(problems).length > 0) {
    const message = Object.entries(problems).map(([f, m]) => `${f}: ${m.join('; ')}`).join('. ');
    throw new BadRequestException({ message, fieldErrors: problems });
  }
  // Points that differ only along these axes share one background, so they are computed together.
  const sharedBackgroundAxes = (spec.axes ?? [])
    .map((axis) => axis.parameter)
    .filter((name) => (PIVOT_AXES as readonly string[]).includes(name) || name === model.scaleParameter);
  return { ...spec, params, phiInit, potentialSource: model.source, sharedBackgroundAxes };
}

export function familyModel(key: string) {
  const family = findFamily(key);
  return family ? { source: family.key, parameters: family.parameters, phiInit: null, isFamily: true, scaleParameter: family.scale?.parameter ?? null } : null;
}

/** The parameter that only scales a group's expression, as the engine detects it (null when none, or when V does not read). */
export function scaleParameterOf(expression: string, parameters: ModelParameter[]): string | null {
  const parsed = parsePotential(expression, parameters.map((p) => p.name), { simplify: false });
  return parsed.ok ? (parsed.potential.scale?.parameter ?? null) : null;
}
