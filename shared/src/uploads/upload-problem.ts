/**
 * Why an uploaded file was refused, with the 1-based line it concerns (absent when the problem is
 * the file as a whole, e.g. too few rows). The message starts with "line N: " when there is a line.
 */
export interface UploadProblem {
  message: string;
  line?: number;
}

/** Thrown by the row readers; the API answers it as a 400 that carries the line. */
export class UploadRejected extends Error {
  constructor(
    message: string,
    readonly line?: number,
  ) {
    super(line === undefined ? message : `line ${line}: ${message}`);
    this.name = 'UploadRejected';
  }
}

/**
 * A refusal from reading a CSV as an UploadProblem: a reader's UploadRejected, or csv-parse's own
 * (an unclosed quote, …; it carries `lines`); null for anything else, which is not about the file.
 */
export function csvReadProblem(error: unknown): UploadProblem | null {
  if (error instanceof UploadRejected) return { message: error.message, ...(error.line !== undefined ? { line: error.line } : {}) };
  // csv-parse's errors carry a code CSV_… (their class is not exported to every bundle alike),
  // all but one: a quote inside an unquoted cell is INVALID_OPENING_QUOTE.
  const code = (error as { code?: unknown } | null)?.code;
  if (error instanceof Error && typeof code === 'string' && (code.startsWith('CSV_') || code === 'INVALID_OPENING_QUOTE')) {
    const line = (error as Error & { lines?: number }).lines;
    const reason = error.message.replace(/^Invalid [^:]*: /, '');
    return line ? { message: `line ${line}: the file is not valid CSV: ${reason}`, line } : { message: `the file is not valid CSV: ${reason}` };
  }
  return null;
}

/**
 * A CSV file read row by row: the parser (streaming, in the API) hands each record with its line,
 * the reader checks it at once and keeps what it needs, and `finish` returns the whole result only
 * when every row passed. Nothing is written anywhere before `finish`.
 */
export interface CsvRowReader<T> {
  header(names: string[], line: number): void;
  row(values: string[], line: number): void;
  finish(): T;
}

/**
 * How every uploaded CSV is split into records (csv-parse options), in the API and in the browser
 * alike: blank lines and lines starting with # are skipped (for notes), cells are trimmed, and
 * rows of the wrong length reach the reader, which names their line.
 */
export const CSV_PARSE_OPTIONS = {
  bom: true,
  trim: true,
  skip_empty_lines: true,
  comment: '#',
  comment_no_infix: true,
  relax_column_count: true,
} as const;

/** A CSV cell as a finite number, or an UploadRejected naming the column and the value. */
export function csvNumber(value: string, column: string, line: number): number {
  const text = value.trim();
  const number = text === '' ? NaN : Number(text);
  if (!Number.isFinite(number)) {
    throw new UploadRejected(text === '' ? `column ${column} is empty` : `column ${column} is not a finite number ('${text}')`, line);
  }
  return number;
}

/** Checks a header against the expected names: no unknown, missing or repeated columns. */
export function checkCsvHeader(names: string[], expected: string[], line: number, optional: string[] = []): void {
  const seen = new Set<string>();
  for (const name of names) {
    if (seen.has(name)) throw new UploadRejected(`column ${name} appears twice`, line);
    seen.add(name);
  }
  const allowed = new Set([...expected, ...optional]);
  const unknown = names.filter((n) => !allowed.has(n));
  const missing = expected.filter((n) => !seen.has(n));
  if (unknown.length || missing.length) {
    const parts = [
      unknown.length ? `unknown column${unknown.length > 1 ? 's' : ''} ${unknown.join(', ')}` : '',
      missing.length ? `missing column${missing.length > 1 ? 's' : ''} ${missing.join(', ')}` : '',
    ].filter(Boolean);
    const wanted = [...expected, ...optional.map((o) => `${o} (optional)`)].join(', ');
    throw new UploadRejected(`${parts.join('; ')}; the header must name ${wanted}`, line);
  }
}
