import { Field, Float64, Int32, makeData, RecordBatch, RecordBatchStreamWriter, Schema, Struct, Utf8, vectorFromArray } from 'apache-arrow';
import { Transform, type Duplex } from 'node:stream';
import { POINT_OUTPUTS, type PointExportFormat, type PointJudge, type PointOutput, type ScanPointDto } from '@sixtyfold/shared';

/**
 * What an export says of itself besides its points: text lines for the CSV's `#` comment header
 * (pandas: `read_csv(path, comment='#')`) and key/value pairs for the Arrow schema's metadata.
 */
export interface ExportAbout {
  lines: string[];
  metadata: Record<string, string>;
}

/** One exported point as the driver hands it over (`rowsAsArray`): the sort key, then the columns of `exportSelect`. */
type ExportRow = [sortKey: unknown, pointIndex: number, inputs: string | Record<string, number>, status: string, failureReason: string | null, ...outputs: (number | null)[]];

/** The content type of each download format. */
export const EXPORT_CONTENT_TYPES: Record<PointExportFormat, string> = {
  csv: 'text/csv; charset=utf-8',
  json: 'application/json; charset=utf-8',
  arrow: 'application/vnd.apache.arrow.stream',
};

/** Text leaves in pieces of about this size: few writes, and each one flushed through compression. */
const TEXT_BATCH_CHARS = 64 * 1024;
/** Rows per Arrow record batch. */
const ARROW_BATCH_ROWS = 64 * 1024;

/**
 * The columns of an export, the same in every format: point index, one per axis, status, reason, then
 * the outputs, without those that are also an axis (N_* on an axis is the same number: one column).
 */
export class ExportColumns {
  readonly outputs: readonly PointOutput[];

  /** `judgedBy`: the likelihood asked for (a set or uploaded regions); each point then ends with its Δχ² and confidence level under it. */
  constructor(readonly axes: readonly string[], readonly judgedBy?: PointJudge) {
    this.outputs = POINT_OUTPUTS.filter((o) => !axes.includes(o));
  }

  get names(): string[] {
    return ['pointIndex', ...this.axes, 'status', 'failureReason', ...this.outputs, ...(this.judgedBy ? ['deltaChi2', 'confidence'] : [])];
  }
}

/** A row's Δχ² and confidence under the export's likelihood (both null for a failed point). */
function judgedRow(judge: PointJudge, row: ExportRow): { deltaChi2: number | null; confidence: number | null } {
  const judgement = judge({ ns: row[OUTPUT_AT.ns] as number | null, r: row[OUTPUT_AT.r] as number | null, alphaS: row[OUTPUT_AT.alphaS] as number | null });
  return { deltaChi2: judgement?.deltaChi2 ?? null, confidence: judgement?.confidence ?? null };
}

/** The stored columns an export SELECTs after the sort key, in the order of `ExportRow` (every output, as the JSON needs them). */
export function exportSelect(column: Record<PointOutput | 'pointIndex', string>): string {
  return ['p.point_index', 'p.inputs', 'p.status', 'p.failure_reason', ...POINT_OUTPUTS.map((o) => `p.${column[o]}`)].join(', ');
}

/** The JSON inputs column: MariaDB's JSON is text, which the driver may hand over unparsed. */
function inputsOf(row: ExportRow): Record<string, number> {
  return typeof row[2] === 'string' ? JSON.parse(row[2]) : row[2];
}

/** Position of each output in an `ExportRow`. */
const OUTPUT_AT = Object.fromEntries(POINT_OUTPUTS.map((o, i) => [o, 5 + i])) as Record<PointOutput, number>;

/** Row arrays in, text out in pieces of about `TEXT_BATCH_CHARS`, starting with `head` and ending with `tail`. */
function textStage(head: string, line: (row: ExportRow, first: boolean) => string, tail: (empty: boolean) => string): Transform {
  let text = head;
  let first = true;
  return new Transform({
    writableObjectMode: true,
    transform(row: ExportRow, _encoding, done) {
      text += line(row, first);
      first = false;
      if (text.length < TEXT_BATCH_CHARS) return done();
      const piece = text;
      text = '';
      done(null, piece);
    },
    flush(done) {
      done(null, text + tail(first));
    },
  });
}

/** A CSV field: text is quoted only when it holds a comma, quote or line break. */
function csvText(value: string | null): string {
  if (value === null) return '';
  // '#' too: the file is read with `comment='#'`, which would cut an unquoted field there.
  return /[",#\r\n]/.test(value) ? `"${value.replaceAll('"', '""')}"` : value;
}

/** A CSV number: JavaScript's shortest round-trip form, empty for none. */
function csvNumber(value: number | null | undefined): string {
  return value === null || value === undefined ? '' : String(value);
}

function csvStage(columns: ExportColumns, about: ExportAbout): Transform {
  const outputsAt = columns.outputs.map((o) => OUTPUT_AT[o]);
  const { axes } = columns;
  const comments = about.lines.map((line) => `# ${line.replace(/[\r\n]+/g, ' ')}\n`).join('');
  return textStage(
    `${comments}${columns.names.join(',')}\n`,
    (row) => {
      const inputs = inputsOf(row);
      let line = String(row[1]);
      for (const axis of axes) line += `,${csvNumber(inputs[axis])}`;
      line += `,${csvText(row[3])},${csvText(row[4])}`;
      for (const at of outputsAt) line += `,${csvNumber(row[at] as number | null)}`;
      if (columns.judgedBy) {
        const { deltaChi2: d, confidence } = judgedRow(columns.judgedBy, row);
        line += `,${csvNumber(d)},${csvNumber(confidence)}`;
      }
      return `${line}\n`;
    },
    () => '',
  );
}

/** The JSON array of points, each as the points page gives it (`ScanPointDto`). */
function jsonStage(columns: ExportColumns): Transform {
  return textStage(
    '',
    (row, first) => {
      const point = { pointIndex: row[1], inputs: inputsOf(row), status: row[3], failureReason: row[4] } as ScanPointDto;
      for (const o of POINT_OUTPUTS) point[o] = row[OUTPUT_AT[o]] as number | null;
      if (columns.judgedBy) Object.assign(point, judgedRow(columns.judgedBy, row));
      return `${first ? '[' : ','}\n${JSON.stringify(point)}`;
    },
    (empty) => (empty ? '[]\n' : '\n]\n'),
  );
}

/**
 * Row arrays in, Arrow record batches of `ARROW_BATCH_ROWS` out (the columns of the CSV: Int32 index,
 * Float64 axes and outputs, null where a point has none, Utf8 status and reason). An export with no row
 * still sends one empty batch, so that the schema is written and readers see the columns.
 */
function arrowBatchStage(columns: ExportColumns, about: ExportAbout): Transform {
  const schema = new Schema([
    new Field('pointIndex', new Int32(), false),
    ...columns.axes.map((a) => new Field(a, new Float64(), false)),
    new Field('status', new Utf8(), false),
    new Field('failureReason', new Utf8(), true),
    ...columns.outputs.map((o) => new Field(o, new Float64(), true)),
    ...(columns.judgedBy ? [new Field('deltaChi2', new Float64(), true), new Field('confidence', new Float64(), true)] : []),
  ], new Map(Object.entries(about.metadata)));
  const outputsAt = columns.outputs.map((o) => OUTPUT_AT[o]);
  let rows: ExportRow[] = [];
  let sent = 0;
  const toBatch = (): RecordBatch => {
    const n = rows.length;
    const inputs = rows.map(inputsOf);
    const children = [
      makeData({ type: new Int32(), length: n, data: Int32Array.from(rows, (r) => r[1]) }),
      ...columns.axes.map((a) => makeData({ type: new Float64(), length: n, data: Float64Array.from(inputs, (i) => i[a]) })),
      vectorFromArray(rows.map((r) => r[3]), new Utf8()).data[0],
      vectorFromArray(rows.map((r) => r[4]), new Utf8()).data[0],
      ...outputsAt.map((at) => vectorFromArray(rows.map((r) => r[at] as number | null), new Float64()).data[0]),
      ...judgedColumns(columns, rows),
    ];
    rows = [];
    sent += n;
    return new RecordBatch(schema, makeData({ type: new Struct(schema.fields), length: n, nullCount: 0, children }));
  };
  return new Transform({
    objectMode: true,
    transform(row: ExportRow, _encoding, done) {
      rows.push(row);
      done(null, rows.length >= ARROW_BATCH_ROWS ? toBatch() : undefined);
    },
    flush(done) {
      done(null, rows.length > 0 || sent === 0 ? toBatch() : undefined);
    },
  });
}

/** The Δχ² and confidence columns of an Arrow batch, when the export is judged by a set. */
function judgedColumns(columns: ExportColumns, rows: ExportRow[]) {
  if (!columns.judgedBy) return [];
  const judgements = rows.map((row) => judgedRow(columns.judgedBy!, row));
  return (['deltaChi2', 'confidence'] as const).map((k) => vectorFromArray(judgements.map((j) => j[k]), new Float64()).data[0]);
}

/** The transforms between the query's row arrays and the response, per format. */
export function exportStages(format: PointExportFormat, columns: ExportColumns, about: ExportAbout): Duplex[] {
  if (format === 'csv') return [csvStage(columns, about)];
  if (format === 'json') return [jsonStage(columns)];
  return [arrowBatchStage(columns, about), RecordBatchStreamWriter.throughNode()];
}
