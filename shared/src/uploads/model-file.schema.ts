import { findNodeAtLocation, parseTree, printParseErrorCode, type Node, type ParseError } from 'jsonc-parser';
import { z } from 'zod';
import { modelInputSchema, modelParameterSchema, type ModelInput, type PotentialModel } from '../schemas/potential-model.schema.js';
import type { UploadProblem } from './upload-problem.js';

export const MODEL_FILE_FORMAT = 'sixtyfold.potential';
export const MODEL_FILE_VERSION = 1;
export const MODEL_FILE_MAX_BYTES = 256 * 1024;

/**
 * A potential model as a file of its own (documented in DEVELOPERS.md, "File formats"). The
 * fields are those of a model without its group: importing puts it into the group chosen then.
 */
export const modelFileSchema = z.object({
  format: z.literal(MODEL_FILE_FORMAT, { error: `format must be "${MODEL_FILE_FORMAT}"` }),
  version: z.literal(MODEL_FILE_VERSION, { error: `version must be ${MODEL_FILE_VERSION}, the only version there is` }),
  name: z.string(),
  expression: z.string(),
  parameters: z.array(modelParameterSchema),
  phiInit: z.number().nullable(),
  description: z.string().default(''),
});
export type ModelFile = z.infer<typeof modelFileSchema>;

/** The file a model exports to. */
export function toModelFile(model: Pick<PotentialModel, 'name' | 'expression' | 'parameters' | 'phiInit' | 'description'>): ModelFile {
  return {
    format: MODEL_FILE_FORMAT,
    version: MODEL_FILE_VERSION,
    name: model.name,
    expression: model.expression,
    parameters: model.parameters.map((p) => ({
      name: p.name,
      defaultValue: p.defaultValue,
      ...(p.min !== undefined ? { min: p.min } : {}),
      ...(p.max !== undefined ? { max: p.max } : {}),
      description: p.description,
    })),
    // Models made before φ_init was required export null; importing such a file asks for a value.
    phiInit: model.phiInit,
    description: model.description,
  };
}

export type ModelFileRead = { ok: true; model: ModelInput } | ({ ok: false } & UploadProblem);

/**
 * Reads a model file for `groupId`: JSON syntax, the file format, then the same rules as a model
 * typed into the form (modelInputSchema). A refusal names the line of the offending value.
 */
export function readModelFile(text: string, groupId: number): ModelFileRead {
  const errors: ParseError[] = [];
  const root = parseTree(text, errors, { disallowComments: true, allowTrailingComma: false, allowEmptyContent: false });
  if (errors.length > 0 || !root) {
    const first = errors[0];
    const offset = first?.offset ?? 0;
    const what = first ? describeSyntaxError(printParseErrorCode(first.error)) : 'the file is empty';
    return refusal(`the file is not valid JSON: ${what}`, lineAt(text, offset));
  }
  if (root.type !== 'object') return refusal('the file must hold one JSON object', lineAt(text, root.offset));
  const value = JSON.parse(text) as Record<string, unknown>;
  const file = modelFileSchema.safeParse(value);
  const checked = file.success
    ? modelInputSchema.safeParse({ groupId, name: file.data.name, expression: file.data.expression, parameters: file.data.parameters, phiInit: file.data.phiInit, description: file.data.description })
    : file;
  if (checked.success) return { ok: true, model: checked.data as ModelInput };
  const issue = checked.error.issues[0];
  const path = issue.path.filter((p): p is string | number => typeof p !== 'symbol');
  const line = lineAt(text, nodeFor(root, path).offset);
  const field = path.length ? path.join('.') : 'the file';
  return refusal(`${field}: ${issue.message}`, line);
}

/** The node at `path`, or the nearest ancestor that exists (a missing field points at its object). */
function nodeFor(root: Node, path: (string | number)[]): Node {
  for (let depth = path.length; depth >= 0; depth--) {
    const node = findNodeAtLocation(root, path.slice(0, depth));
    if (node) return node;
  }
  return root;
}

function refusal(message: string, line: number): { ok: false } & UploadProblem {
  return { ok: false, message: `line ${line}: ${message}`, line };
}

function lineAt(text: string, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset && i < text.length; i++) if (text.charCodeAt(i) === 10) line++;
  return line;
}

/** jsonc-parser's codes (e.g. "CommaExpected") as words. */
function describeSyntaxError(code: string): string {
  const words = code.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase();
  return words.replace(/ expected$/, ' expected here').replace(/^invalid symbol$/, 'unexpected character');
}
