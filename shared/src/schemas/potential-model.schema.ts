import { z } from 'zod';
import { MAX_POTENTIAL_LENGTH, parameterNameProblem, parsePotential } from '../engine/expression/index.js';

/** One named parameter of a potential, with the range a scan form offers by default. */
export const modelParameterSchema = z.object({
  name: z.string().regex(/^[A-Za-z][A-Za-z0-9_]*$/, 'Parameter names start with a letter and use letters, digits and _'),
  defaultValue: z.number().finite(),
  min: z.number().finite().optional(),
  max: z.number().finite().optional(),
  description: z.string().max(500).default(''),
});
export type ModelParameter = z.infer<typeof modelParameterSchema>;

/** A group's own potential model as the API returns it. */
export const potentialModelSchema = z.object({
  id: z.number().int(),
  groupId: z.number().int(),
  name: z.string(),
  expression: z.string(),
  parameters: z.array(modelParameterSchema),
  phiInit: z.number().nullable(),
  description: z.string(),
  createdById: z.number().int().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type PotentialModel = z.infer<typeof potentialModelSchema>;

export type PotentialExpressionCheck =
  | { ok: true; usedParameters: string[] }
  | { ok: false; message: string; index?: number; length?: number };

/** Recent answers of checkPotentialExpression, most recent last. */
const recentChecks = new Map<string, PotentialExpressionCheck>();
const RECENT_CHECKS = 32;

/**
 * Checks a potential V(phi) the way a scan will read it, with `parameterNames` declared besides
 * the field phi. `message` says where (the 1-based character, for people) and why; `index` and
 * `length` are 0-based offsets in `expression` for highlighting.
 *
 * Parsing differentiates the expression three times (unsimplified: fast, but still work for a
 * long one), so the last answers are kept: a form that validates every field on each keystroke asks
 * again only when the expression or the parameter names change. Same input, same answer.
 */
export function checkPotentialExpression(expression: string, parameterNames: string[]): PotentialExpressionCheck {
  const key = JSON.stringify([expression, parameterNames]);
  let check = recentChecks.get(key);
  if (check) {
    recentChecks.delete(key);
  } else {
    check = readPotential(expression, parameterNames);
    if (recentChecks.size >= RECENT_CHECKS) recentChecks.delete(recentChecks.keys().next().value!);
  }
  recentChecks.set(key, check);
  return check.ok ? { ok: true, usedParameters: [...check.usedParameters] } : { ...check };
}

function readPotential(expression: string, parameterNames: string[]): PotentialExpressionCheck {
  // Whether V reads and differentiates does not depend on simplifying its derivatives, which
  // alone can take seconds for a short expression (about 3 s for cos(phi) / log(0.01 * phi)).
  const parsed = parsePotential(expression, parameterNames, { simplify: false });
  if (parsed.ok) return { ok: true, usedParameters: [...parsed.potential.parameterNames] };
  const { message, index, length } = parsed.problem;
  if (index === undefined) return { ok: false, message };
  // The engine names the position inside its sentence; here it leads, once.
  const reason = message.replace(/ at (character \d+|the end of the expression)/, '');
  const where = index >= expression.length ? 'at the end of the expression' : `at character ${index + 1}`;
  return { ok: false, message: `${where}: ${reason.charAt(0).toLowerCase()}${reason.slice(1)}`, index, length };
}

const modelName = z.string({ error: 'give the model a name' }).trim().min(1, 'give the model a name').max(120, 'a model name has at most 120 characters');
const modelExpression = z
  .string({ error: 'write V in terms of phi' })
  .min(1, 'write V in terms of phi, e.g. lambda * phi^4')
  .max(MAX_POTENTIAL_LENGTH, `the expression has at most ${MAX_POTENTIAL_LENGTH} characters`);
const modelParameters = z
  .array(modelParameterSchema, { error: 'list the parameters (an empty list when V has none)' })
  .max(12, 'a model has at most 12 parameters');
const modelPhiInit = z.number({ error: 'give φ_init, the field value where inflation starts (M_pl = 1)' }).finite('φ_init must be a finite number');
const modelDescription = z.string().max(2000, 'the description has at most 2000 characters');

interface ModelFields {
  expression?: string;
  parameters?: ModelParameter[];
}

/**
 * The cross-field rules of a model, for creating and editing alike: unique parameter names that
 * the engine accepts (never phi, the field), min < max, the default inside [min, max], and an
 * expression that reads with these parameters. Fields left out are not checked here.
 */
function refineModel(model: ModelFields, ctx: z.RefinementCtx): void {
  // Runs even when other fields failed (see refineAlways), so it trusts no field's type.
  const parameters = Array.isArray(model.parameters) ? model.parameters : undefined;
  let namesOk = true;
  const seen = new Set<string>();
  parameters?.forEach((p, i) => {
    if (typeof p?.name !== 'string') {
      namesOk = false;
      return;
    }
    const at = ['parameters', i, 'name'];
    if (p.name === 'phi') {
      ctx.addIssue({ code: 'custom', path: at, message: 'phi is the field; give the parameter another name' });
      namesOk = false;
    } else if (seen.has(p.name)) {
      ctx.addIssue({ code: 'custom', path: at, message: `there is already a parameter named ${p.name}` });
      namesOk = false;
    } else if (!modelParameterSchema.shape.name.safeParse(p.name).success) {
      namesOk = false; // the field's own rule has said why
    } else {
      const problem = parameterNameProblem(p.name);
      if (problem) {
        ctx.addIssue({ code: 'custom', path: at, message: problem });
        namesOk = false;
      }
    }
    seen.add(p.name);
    const number = (v: unknown) => (typeof v === 'number' ? v : undefined);
    const [min, max, defaultValue] = [number(p.min), number(p.max), number(p.defaultValue)];
    if (min !== undefined && max !== undefined && !(min < max)) {
      ctx.addIssue({ code: 'custom', path: ['parameters', i, 'max'], message: `max must be above min (${min})` });
    }
    if (defaultValue !== undefined) {
      if (min !== undefined && defaultValue < min) {
        ctx.addIssue({ code: 'custom', path: ['parameters', i, 'defaultValue'], message: `the default must be at least min (${min})` });
      }
      if (max !== undefined && defaultValue > max) {
        ctx.addIssue({ code: 'custom', path: ['parameters', i, 'defaultValue'], message: `the default must be at most max (${max})` });
      }
    }
  });
  // The expression is read against the parameters, so only once their names are settled.
  const expression = model.expression;
  if (typeof expression === 'string' && expression.length > 0 && expression.length <= MAX_POTENTIAL_LENGTH && parameters && namesOk) {
    const check = checkPotentialExpression(expression, parameters.map((p) => p.name));
    if (!check.ok) ctx.addIssue({ code: 'custom', path: ['expression'], message: check.message });
  }
}

/**
 * Zod skips a refinement once a field is missing or of the wrong type; a form should still learn
 * about a duplicate parameter while φ_init is empty, so the rules run on any object.
 */
const refineAlways = { when: (payload: { value: unknown }) => typeof payload.value === 'object' && payload.value !== null && !Array.isArray(payload.value) };

/** `POST /api/models`: a new potential model of a group. */
export const modelInputSchema = z
  .object({
    groupId: z.number({ error: 'choose the group' }).int().positive(),
    name: modelName,
    expression: modelExpression,
    parameters: modelParameters,
    phiInit: modelPhiInit,
    description: modelDescription.default(''),
  })
  .superRefine(refineModel, refineAlways);
export type ModelInput = z.infer<typeof modelInputSchema>;

/**
 * `PATCH /api/models/:id`: the fields to replace, any of them. The API checks the result
 * (stored fields with these replaced) by the same rules, so an expression that uses a
 * parameter being removed is refused.
 */
export const modelUpdateSchema = z
  .object({
    name: modelName.optional(),
    expression: modelExpression.optional(),
    parameters: modelParameters.optional(),
    phiInit: modelPhiInit.optional(),
    description: modelDescription.optional(),
  })
  .superRefine(refineModel, refineAlways);
export type ModelUpdate = z.infer<typeof modelUpdateSchema>;
