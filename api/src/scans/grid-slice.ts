import { BadRequestException } from '@nestjs/common';
import type { DataSource } from 'typeorm';
import { FAILURE_CODES, roundForSlice, ScanGrid, type ScanAxis, type ScanGridQuery, type ScanGridSlice } from '@sixtyfold/shared';
import { openQueryStream } from '../exports/query-stream';

type SliceOutput = ScanGridQuery['output'];
/** The scan_points column of each output a slice can average (API name → column). */
export type SliceColumns = Record<Exclude<SliceOutput, 'status'>, string>;

/**
 * Where a slice's cells lie, for every output alike: the axes' windows and blocks (the answer's `x`
 * and `y`), where the other axes are cut (`at`), and the SQL of each point's group (its cell and
 * status) and of the points the slice takes.
 */
export interface SlicePlan {
  x: ScanGridSlice['x'];
  y: ScanGridSlice['y'];
  at: ScanGridSlice['at'];
  group: string;
  where: string;
  parameters: unknown[];
}

/** What a stored point's status can be. FIELD() numbers them from 1 (0 would be a status not listed). */
const POINT_STATUSES = ['ok', ...FAILURE_CODES] as const;
/** Room for every status in a group key (POINT_STATUSES has 14). */
const STATUS_KEYS = 16;
/** Bytes of memory MariaDB may give one slice's grouping before it moves it to disk. */
const GROUPING_MEMORY = 64 * 2 ** 20;

/** Validates the query against the scan's axes (400 naming each bad field) and plans its cells. */
export function planSlice(axes: ScanAxis[], q: ScanGridQuery): SlicePlan {
  const grid = new ScanGrid(axes);
  const names = axes.map((a) => a.parameter);
  const xi = names.indexOf(q.x);
  const yi = names.indexOf(q.y);
  const range = (a: number) => `${names[a]} has ${grid.lengths[a]} values (index 0 to ${grid.lengths[a] - 1})`;
  const bad: Record<string, string[]> = {};
  if (xi < 0) bad.x = [`the scan has no axis ${q.x}; it has ${names.join(', ')}`];
  if (yi < 0) bad.y = [`the scan has no axis ${q.y}; it has ${names.join(', ')}`];
  if (xi >= 0 && xi === yi) bad.y = ['x and y must be different axes'];
  for (const [name, index] of Object.entries(q.at)) {
    const a = names.indexOf(name);
    if (a < 0) bad[`at.${name}`] = [`the scan has no axis ${name}`];
    else if (index >= grid.lengths[a]) bad[`at.${name}`] = [range(a)];
  }
  for (const [axis, a] of [['x', xi], ['y', yi]] as const) {
    for (const end of ['From', 'To'] as const) {
      const index = q[`${axis}${end}`];
      if (a >= 0 && index !== undefined && index >= grid.lengths[a]) bad[`${axis}${end}`] = [range(a)];
    }
  }
  if (Object.keys(bad).length) throw badRequest(bad);

  const cell = names.map((name) => q.at[name] ?? 0);
  const at: ScanGridSlice['at'] = {};
  names.forEach((name, a) => {
    if (a !== xi && a !== yi) at[name] = { index: cell[a], value: grid.values[a][cell[a]] };
  });
  const sliceAxis = (a: number, from = 0, to = grid.lengths[a] - 1) => {
    const block = Math.ceil((to - from + 1) / q.maxCells);
    const cells = Math.ceil((to - from + 1) / block);
    return { parameter: names[a], length: grid.lengths[a], from, to, block, values: Array.from({ length: cells }, (_, i) => grid.values[a][from + i * block]) };
  };
  const x = sliceAxis(xi, q.xFrom, q.xTo);
  const y = sliceAxis(yi, q.yFrom, q.yTo);
  if (x.from > x.to) throw badRequest({ xTo: [`must not be below xFrom (${x.from})`] });
  if (y.from > y.to) throw badRequest({ yTo: [`must not be below yFrom (${y.from})`] });

  // Point index = Σ digit[a] · stride[a] (last axis fastest).
  const stride = grid.lengths.map((_, a) => grid.lengths.slice(a + 1).reduce((n, l) => n * l, 1));
  const first = grid.indexOf(names.map((_, a) => (a === xi ? x.from : a === yi ? y.from : cell[a])));
  const last = grid.indexOf(names.map((_, a) => (a === xi ? x.to : a === yi ? y.to : cell[a])));
  const digit = (a: number) => {
    const shifted = stride[a] === 1 ? 'point_index' : `point_index DIV ${stride[a]}`;
    return a === 0 ? `(${shifted})` : `(${shifted} MOD ${grid.lengths[a]})`;
  };
  // Inside [first, last] only digits faster than the slower of x and y can stray from the slice.
  const slower = Math.max(stride[xi], stride[yi]);
  const conditions: string[] = [];
  names.forEach((_, a) => {
    if (stride[a] >= slower) return;
    if (a === xi) {
      if (x.from > 0 || x.to < x.length - 1) conditions.push(`${digit(a)} BETWEEN ${x.from} AND ${x.to}`);
    } else if (a === yi) {
      if (y.from > 0 || y.to < y.length - 1) conditions.push(`${digit(a)} BETWEEN ${y.from} AND ${y.to}`);
    } else conditions.push(`${digit(a)} = ${cell[a]}`);
  });
  // Every digit in the window is ≥ its `from`, so the unsigned subtractions stay ≥ 0.
  const cellOf = (a: number, axis: { from: number; block: number }) => {
    const offset = axis.from ? `(${digit(a)} - ${axis.from})` : digit(a);
    return axis.block > 1 ? `(${offset} DIV ${axis.block})` : offset;
  };
  // The group is one integer, cell · STATUS_KEYS + the status's place in POINT_STATUSES: a narrow
  // key keeps MariaDB's temporary table small.
  const group = `(${cellOf(yi, y)} * ${x.values.length} + ${cellOf(xi, x)}) * ${STATUS_KEYS} + FIELD(status, ${POINT_STATUSES.map((s) => `'${s}'`).join(', ')})`;
  const where = `scan_id = ? AND point_index BETWEEN ? AND ?${conditions.map((c) => ` AND ${c}`).join('')}`;
  return { x, y, at, group, where, parameters: [first, last] };
}

function badRequest(fieldErrors: Record<string, string[]>) {
  return new BadRequestException({ message: Object.entries(fieldErrors).map(([k, v]) => `${k}: ${v.join('; ')}`).join('. '), fieldErrors });
}

/**
 * Reads a slice of each of `outputs` in one pass over the points: MariaDB adds them up per cell and
 * status, so only the blocks cross the wire, not a million rows, and each further output costs
 * its four aggregates, not another read. The grouping stays in memory up to GROUPING_MEMORY (a
 * 512 × 512 slice with two statuses fits; past it MariaDB goes on on disk, slower, same answer).
 */
export async function readSlices(db: DataSource, scanId: number, plan: SlicePlan, outputs: SliceOutput[], columns: SliceColumns): Promise<Map<SliceOutput, ScanGridSlice>> {
  const valued = outputs.filter((o): o is Exclude<SliceOutput, 'status'> => o !== 'status');
  const figures = valued.map((o) => `, COUNT(${columns[o]}), SUM(${columns[o]}), MIN(${columns[o]}), MAX(${columns[o]})`).join('');
  const sql = `SET STATEMENT tmp_memory_table_size = ${GROUPING_MEMORY}, max_heap_table_size = ${GROUPING_MEMORY} FOR
    SELECT ${plan.group} AS k, COUNT(*)${figures} FROM scan_points WHERE ${plan.where} GROUP BY k ORDER BY NULL`;

  const cells = plan.x.values.length * plan.y.values.length;
  const ok = new Array<number>(cells).fill(0);
  const failed = new Map<string, number[]>();
  const figuresOf = valued.map(() => ({ count: new Float64Array(cells), sum: new Float64Array(cells), min: new Float64Array(cells), max: new Float64Array(cells) }));
  const source = await openQueryStream(db, sql, [scanId, ...plan.parameters], { rowsAsArray: true });
  let completed = false;
  try {
    // Integers may come as strings (the driver's big-number setting); the doubles come as numbers.
    for await (const row of source.readable as AsyncIterable<(number | string | null)[]>) {
      const key = Number(row[0]);
      const c = Math.floor(key / STATUS_KEYS);
      // A status not listed (FIELD gives 0) is counted as 'unknown' rather than lost.
      const status = POINT_STATUSES[(key % STATUS_KEYS) - 1] ?? 'unknown';
      if (status !== 'ok') {
        let counts = failed.get(status);
        if (!counts) failed.set(status, (counts = new Array<number>(cells).fill(0)));
        counts[c] += Number(row[1]);
        continue;
      }
      ok[c] += Number(row[1]);
      // An OK point has its outputs stored with its status; one without (never expected) is not averaged.
      figuresOf.forEach((f, i) => {
        f.count[c] = Number(row[2 + 4 * i]);
        f.sum[c] = Number(row[3 + 4 * i]);
        f.min[c] = Number(row[4 + 4 * i]);
        f.max[c] = Number(row[5 + 4 * i]);
      });
    }
    completed = true;
  } finally {
    await source.close(completed);
  }

  const counts = { x: plan.x, y: plan.y, ok, failed: Object.fromEntries(failed), at: plan.at };
  const blocks = plan.x.block * plan.y.block > 1;
  // In the order asked.
  return new Map(outputs.map((output): [SliceOutput, ScanGridSlice] => {
    if (output === 'status') return [output, { ...counts, output }];
    const f = figuresOf[valued.indexOf(output)];
    const column = (values: Float64Array) => Array.from(values, (v, c) => (f.count[c] ? roundForSlice(v) : null));
    return [output, {
      ...counts, output,
      mean: Array.from(f.sum, (sum, c) => (f.count[c] ? roundForSlice(sum / f.count[c]) : null)),
      ...(blocks && { min: column(f.min), max: column(f.max) }),
    }];
  }));
}
