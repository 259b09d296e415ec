import type { ModelParameter } from '@sixtyfold/shared';

/** A number typed into a field (1e-10, -0.5, 7), or null when it is not a finite number. */
export function readNumber(text: string): number | null {
  const trimmed = text.trim().replace('−', '-');
  if (trimmed === '') return null;
  const value = Number(trimmed);
  return Number.isFinite(value) ? value : null;
}

/** Each parameter's default as text, to prefill the value fields. */
export function defaultValueTexts(parameters: readonly ModelParameter[]): Record<string, string> {
  return Object.fromEntries(parameters.map((p) => [p.name, String(p.defaultValue)]));
}

export type ReadValues = { ok: true; values: Record<string, number> } | { ok: false; errors: Record<string, string> };

/** The typed values as numbers, or a message for each field that is not a number. */
export function readValues(parameters: readonly ModelParameter[], texts: Readonly<Record<string, string>>): ReadValues {
  const values: Record<string, number> = {};
  const errors: Record<string, string> = {};
  for (const p of parameters) {
    const value = readNumber(texts[p.name] ?? '');
    if (value === null) errors[p.name] = `Enter a number for ${p.name}, e.g. ${p.defaultValue}`;
    else values[p.name] = value;
  }
  return Object.keys(errors).length > 0 ? { ok: false, errors } : { ok: true, values };
}
