import fc from 'fast-check';
import type { Response } from 'supertest';
import type { z } from 'zod';

/**
 * Shared parts of the fuzz suite (fuzz.e2e-spec.ts): the seed, the tally of answers per target,
 * the checks every answer must pass, and generators of near-valid and junk inputs.
 */

/** One seed for the whole run; each target (and each of its lanes) adds its own offset. */
export const FUZZ_SEED = Number(process.env.FUZZ_SEED ?? 20261204);

/** A request's answer, as the checks need it. */
export interface Answer {
  status: number;
  body: { message?: unknown; fieldErrors?: Record<string, string[]>; line?: unknown } & Record<string, unknown>;
  text: string;
  ms: number;
}

/** Sends a request and measures it; supertest's promise resolves for every status. */
export async function timed(send: () => PromiseLike<Response>): Promise<Answer> {
  const started = performance.now();
  const res = await send();
  const ms = performance.now() - started;
  return { status: res.status, body: (res.body ?? {}) as Answer['body'], text: res.text ?? '', ms };
}

/** The slowest an answer may be, whatever the input. */
export const MAX_ANSWER_MS = 2000;

/** Answers per target, printed at the end of the run. */
export class FuzzTally {
  private readonly targets = new Map<string, { seed: number; inputs: number; statuses: Map<number, number>; slowestMs: number; slowestInput: string }>();

  record(target: string, seed: number, answer: Answer, input: unknown): void {
    const t = this.targets.get(target) ?? { seed, inputs: 0, statuses: new Map(), slowestMs: 0, slowestInput: '' };
    t.inputs++;
    t.statuses.set(answer.status, (t.statuses.get(answer.status) ?? 0) + 1);
    if (answer.ms > t.slowestMs) Object.assign(t, { slowestMs: answer.ms, slowestInput: shown(input).slice(0, 300) });
    this.targets.set(target, t);
  }

  get total(): number {
    return [...this.targets.values()].reduce((n, t) => n + t.inputs, 0);
  }

  report(): string {
    const lines = [...this.targets.entries()].map(([name, t]) => {
      const count = (from: number) => [...t.statuses].filter(([s]) => s >= from && s < from + 100).reduce((n, [, c]) => n + c, 0);
      const statuses = [...t.statuses].sort(([a], [b]) => a - b).map(([s, c]) => `${s}×${c}`).join(' ');
      return `  ${name.padEnd(28)} seeds ${t.seed}+  inputs ${String(t.inputs).padStart(5)}  2xx ${String(count(200)).padStart(5)}  4xx ${String(count(400)).padStart(5)}  5xx ${count(500)}  slowest ${Math.round(t.slowestMs)} ms  (${statuses})`;
    });
    const slowest = [...this.targets.values()].reduce((a, b) => (b.slowestMs > a.slowestMs ? b : a));
    return [`fuzz: ${this.total} inputs (FUZZ_SEED=${FUZZ_SEED})`, ...lines, `  slowest input (${Math.round(slowest.slowestMs)} ms): ${slowest.slowestInput}`].join('\n');
  }
}

/** An input as JSON, long strings and file bytes shortened so that a report stays readable. */
function shown(input: unknown): string {
  const text = JSON.stringify(input, (_key, value: unknown) =>
    typeof value === 'string' && value.length > 300 ? `${value.slice(0, 300)}… (${value.length} characters)`
    : value && typeof value === 'object' && (value as { type?: unknown }).type === 'Buffer' ? `<${(value as { data: unknown[] }).data.length} bytes: ${Buffer.from((value as { data: number[] }).data.slice(0, 200)).toString('utf8')}>`
    : value,
  );
  return text === undefined ? String(input) : text;
}

function fail(what: string, answer: Answer, input: unknown): never {
  throw new Error(`${what}\nanswer ${answer.status} in ${Math.round(answer.ms)} ms: ${answer.text.slice(0, 600)}\ninput: ${shown(input).slice(0, 1200)}`);
}

/** For inputs whose outcome is known in advance (a valid one is stored, say). */
export function expectStatus(answer: Answer, statuses: number[], input: unknown): void {
  if (!statuses.includes(answer.status)) fail(`expected ${statuses.join(' or ')}`, answer, input);
}

const FIELD_PREFIX = /^[A-Za-z_$][\w$.\-[\]]*: /;

/** What a 4xx must say, by where the input came from. */
export type Origin = 'body' | 'query' | 'upload';

/**
 * The rules for every answer: 2xx or 4xx, never 5xx (or a redirect), within MAX_ANSWER_MS, and a
 * 4xx with a message. A 400 names what was wrong: a field (in `fieldErrors`, or leading the
 * message as "field: …") for bodies and queries (or says that the body is not JSON, and where),
 * and for uploads also a `line` or the file.
 */
export function checkAnswer(answer: Answer, input: unknown, origin: Origin): void {
  if (answer.status >= 500) fail('a server error', answer, input);
  if (!(answer.status >= 200 && answer.status < 300) && !(answer.status >= 400 && answer.status < 500)) fail('neither 2xx nor 4xx', answer, input);
  if (answer.ms > MAX_ANSWER_MS) fail(`slower than ${MAX_ANSWER_MS} ms`, answer, input);
  if (answer.status < 400) return;
  const { message, fieldErrors, line } = answer.body;
  if (typeof message !== 'string' || message.trim() === '') fail('a 4xx without a message', answer, input);
  if (answer.status !== 400) return;
  // "_" stands for the input as a whole (a body that is not an object, or a rule over several fields).
  const names = Object.keys(fieldErrors ?? {}).length > 0 || FIELD_PREFIX.test(message);
  if (origin === 'upload') {
    const onLine = typeof line === 'number' && Number.isInteger(line) && line >= 1 && message.startsWith(`line ${line}: `);
    if (!names && !onLine && !/\bfile\b/.test(message)) fail('a 400 naming neither a field, a line nor the file', answer, input);
  } else if (!names && !message.startsWith('The request body is not valid JSON: ')) {
    fail('a 400 that names no field', answer, input);
  }
}

/**
 * For an input the shared schema refuses, the API must refuse it with a 400 naming exactly the
 * fields the schema names: the same schema runs in the pipe, so the field paths must agree.
 */
export function checkSchemaRefusal(answer: Answer, input: unknown, result: z.ZodSafeParseResult<unknown>): void {
  if (result.success) return;
  if (answer.status !== 400) fail(`the schema refuses this input (${result.error.issues[0].message}) but the API did not answer 400`, answer, input);
  const expected = [...new Set(result.error.issues.map((i) => (i.path.length ? i.path.join('.') : '_')))].sort();
  const got = Object.keys(answer.body.fieldErrors ?? {}).sort();
  if (JSON.stringify(expected) !== JSON.stringify(got)) fail(`fieldErrors ${JSON.stringify(got)} differ from the schema's ${JSON.stringify(expected)}`, answer, input);
}

// ---------------------------------------------------------------------------------------------
// Generators

const long = (unit: string, times: number) => unit.repeat(times);

/** Values that break a field: wrong types, non-finite text, huge and tiny numbers, odd strings. */
export const badValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom<unknown>(
    null, true, false, '', ' ', '\t\n', 'NaN', 'Infinity', '-Infinity', '1e309', '0x10', '1_000', '١٢٣', '\u0000', '😀', '\u202e', 'null', 'undefined',
    0, -1, -0, 0.5, 1e308, -1e308, 2 ** 53 + 1, -(2 ** 31), 2 ** 31, 5e-324, 1e-320,
    [], {}, [1], [[]], { a: 1 }, { __proto__: null, constructor: 1 }, ['x'],
    long('a', 10_000), long('é', 3000), long('😀', 1000), long('9', 400),
  ),
  fc.string({ unit: 'grapheme', maxLength: 24 }),
  fc.double(),
  fc.integer(),
  fc.jsonValue({ maxDepth: 2 }),
);

/** Every path into a JSON value (objects and arrays), its root excluded. */
export function pathsOf(value: unknown, prefix: (string | number)[] = []): (string | number)[][] {
  if (Array.isArray(value)) return value.flatMap((v, i) => [[...prefix, i], ...pathsOf(v, [...prefix, i])]);
  if (value && typeof value === 'object') return Object.entries(value).flatMap(([k, v]) => [[...prefix, k], ...pathsOf(v, [...prefix, k])]);
  return [];
}

function setAt(root: unknown, path: (string | number)[], change: (parent: Record<string | number, unknown>, key: string | number) => void): unknown {
  const copy = structuredClone(root) as Record<string | number, unknown>;
  let parent = copy;
  for (const key of path.slice(0, -1)) parent = parent[key] as Record<string | number, unknown>;
  change(parent, path[path.length - 1]);
  return copy;
}

/** A JSON body as sent: the text (which may hold what JSON.stringify never writes) and its value. */
export interface JsonInput {
  text: string;
  /** The body the API's parser hands on (JSON.parse(text)), or undefined when it refuses the text. */
  value: unknown;
  how: string;
}

/** What the API's JSON parser hands on: objects and arrays (it is strict); anything else is refused as not JSON. */
function parsedBody(text: string): unknown {
  try {
    const value: unknown = JSON.parse(text);
    return typeof value === 'object' && value !== null ? value : undefined;
  } catch {
    return undefined;
  }
}
const asInput = (value: unknown, how: string): JsonInput => {
  const text = JSON.stringify(value) ?? '';
  return { text, value: parsedBody(text), how };
};
const rawInput = (text: string, how: string): JsonInput => ({ text, value: parsedBody(text), how });

/** One field of a valid value broken: replaced, removed, duplicated, or written as an out-of-range number. */
export function nearValid(valid: fc.Arbitrary<unknown>): fc.Arbitrary<JsonInput> {
  return fc.tuple(valid, fc.nat(), fc.nat(5), badValue, fc.string({ maxLength: 12 })).map(([value, pick, kind, bad, key]) => {
    const paths = pathsOf(value);
    if (paths.length === 0) return asInput(bad, 'replaced the whole body');
    const path = paths[pick % paths.length];
    const field = path.join('.');
    switch (kind) {
      case 0:
      case 1:
        return asInput(setAt(value, path, (p, k) => void (p[k] = bad)), `${field} replaced`);
      case 2:
        return asInput(setAt(value, path, (p, k) => (Array.isArray(p) ? void p.splice(Number(k), 1) : void delete p[k])), `${field} removed`);
      case 3:
        return asInput(setAt(value, path, (p) => void (Array.isArray(p) ? p.push(bad) : (p[`x${key}`] = bad))), `an unknown field beside ${field}`);
      case 4: {
        // JSON.parse keeps the last of duplicate keys: the broken value first, then the original last, or the other way round.
        const text = JSON.stringify(value);
        const top = String(path[0]);
        const dup = `${JSON.stringify(top)}:${JSON.stringify(bad) ?? 'null'}`;
        return pick % 2 === 0 ? rawInput(`{${dup},${text.slice(1)}`, `${top} duplicated before`) : rawInput(`${text.slice(0, -1)},${dup}}`, `${top} duplicated after`);
      }
      default: {
        // Numbers JSON.stringify never writes: 1e400 parses to Infinity, 1e-400 to 0; NaN is not JSON at all.
        const marker = '"__number__"';
        const text = JSON.stringify(setAt(value, path, (p, k) => void (p[k] = '__number__')));
        return rawInput(text.replace(marker, ['1e400', '-1e400', '1e-400', 'NaN', '-0', '00', '1.', '.5', '+1'][pick % 9]), `${field} as a raw number`);
      }
    }
  });
}

/** Junk bodies: any JSON value, text that is almost JSON, and nothing at all. */
export const junkJson: fc.Arbitrary<JsonInput> = fc.oneof(
  fc.jsonValue({ maxDepth: 3 }).map((v) => asInput(v, 'any JSON')),
  fc.string({ unit: 'grapheme', maxLength: 60 }).map((s) => rawInput(s, 'any text')),
  fc.constantFrom('', '{', '{}', '[]', 'null', '{"a":', '{"groupId":1,}', "{'groupId':1}", '{"groupId":1}/*c*/', '\uFEFF{}', '{"__proto__":{"x":1}}', '{"constructor":{"prototype":{}}}').map((s) => rawInput(s, 'almost JSON')),
);

/** Inputs for a body route: valid ones, near-valid ones and junk, in that proportion. */
export function bodyInputs(valid: fc.Arbitrary<unknown>, weights = { valid: 3, near: 6, junk: 1 }): fc.Arbitrary<JsonInput> {
  return fc.oneof(
    { arbitrary: valid.map((v) => asInput(v, 'valid')), weight: weights.valid },
    { arbitrary: nearValid(valid), weight: weights.near },
    { arbitrary: junkJson, weight: weights.junk },
  );
}

// ---------------------------------------------------------------------------------------------
// CSV files

/** A finite number as a CSV cell, in the spellings people write. */
export const csvNumberText = (n: number) => fc.constantFrom(String(n), n.toExponential(), n.toPrecision(12), ` ${n} `);

/** Ways to spoil a well-formed CSV text; each keeps the rest of the file as it was. */
export function spoiledCsv(text: string, pick: number, cell: string): { text: string; how: string } {
  const lines = text.split('\n');
  const at = 1 + (pick % Math.max(1, lines.length - 1));
  const withLine = (replace: (line: string) => string, how: string) => ({ text: lines.map((l, i) => (i === at ? replace(l) : l)).join('\n'), how });
  const spoilers: (() => { text: string; how: string })[] = [
    () => ({ text: `\uFEFF${text}`, how: 'BOM' }),
    () => ({ text: text.replace(/\n/g, '\r\n'), how: 'CRLF' }),
    () => ({ text: text.replace(/\n/g, '\r'), how: 'CR only' }),
    () => withLine((l) => l.replace(/[^,]+$/, cell), `a cell ${JSON.stringify(cell)}`),
    () => withLine((l) => l.replace(/^[^,]*/, cell), `a first cell ${JSON.stringify(cell)}`),
    () => withLine((l) => `${l},1`, 'an extra value'),
    () => withLine((l) => l.replace(/,[^,]*$/, ''), 'a missing value'),
    () => withLine((l) => `"${l}`, 'an unclosed quote'),
    () => withLine((l) => l.replace(/^([^,]*)/, '"$1"x'), 'text after a closing quote'),
    () => withLine((l) => l.replace(/^([^,]*)/, '"$1"'), 'a quoted cell'),
    () => withLine((l) => `${l}\n# a note\n\n`, 'a note and a blank line'),
    () => withLine((l) => `${l} # trailing`, 'a trailing comment'),
    () => withLine((l) => l.replace(/,/g, ';'), 'semicolons'),
    () => withLine((l) => l.replace(/,/g, '\t'), 'tabs'),
    () => withLine(() => '', 'an empty row'),
    () => withLine((l) => `${l}\u0000`, 'a NUL byte'),
    () => ({ text: `${lines[0]},${lines[0].split(',')[0]}\n${lines.slice(1).join('\n')}`, how: 'a header column twice' }),
    () => ({ text: `${lines[0]},${cell}\n${lines.slice(1).join('\n')}`, how: `a header column ${JSON.stringify(cell)}` }),
    () => ({ text: `${lines[0]},\n${lines.slice(1).join('\n')}`, how: 'an unnamed header column' }),
    () => ({ text: lines.slice(1).join('\n'), how: 'no header' }),
    () => ({ text: lines[0], how: 'only the header' }),
    () => ({ text: '', how: 'an empty file' }),
    () => ({ text: '# only notes\n\n', how: 'only notes' }),
    () => ({ text: `${text}\n`.repeat(3), how: 'the file three times' }),
  ];
  return spoilers[pick % spoilers.length]();
}

/** Cells that are not finite numbers, or are numbers in odd spellings. */
export const oddCell = fc.oneof(
  fc.constantFrom('', ' ', 'NaN', 'Infinity', '-Infinity', '1e400', '-1e400', '1e-400', '0x1A', '0b11', '1,5', '1.5.5', '--1', '+1', '.5', '5.', '١', '１', 'fifty', '"', '""', '"1"', '=1+1', '\u00a01'),
  fc.string({ unit: 'grapheme', maxLength: 12 }),
);
