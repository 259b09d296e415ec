import { BadRequestException } from '@nestjs/common';
import type { DataSource } from 'typeorm';
import { FAILURE_CODES, roundForSlice, ScanGrid, type ScanAxis, type ScanGridQuery, type ScanGridSlice } from '@sixtyfold/shared';
import { openQueryStream } from '../exports/query-stream';

/** The scan_points column of each output a slice can average (API name → column). */
export type SliceColumns = Record<Exclude<ScanGridQuery['output'], 'status'>, string>;

/**
 * What one slice reads and how it answers: the axes' windows and blocks (the answer's `x` and `y`),
 * where the other axes are cut (`at`), and the one aggregating SELECT that gives each cell's figures.
 */
export interface SlicePlan {
  x: ScanGridSlice['x'];
  y: ScanGridSlice['y'];
  at: ScanGridSlice['at'];
  output: ScanGridQuery['output'];
  /** Whether the SELECT reads an output column (every output but status). */
  valued: boolean;
  sql: string;
  parameters: unknown[];
}

/** What a stored point's status can be. FIELD() numbers them from 1 (0 would be a status not listed). */
const POINT_STATUSES = ['ok', ...FAILURE_CODES] as const;
const STATUS_KEYS = 16;
/** Bytes of memory MariaDB may give one slice's grouping before it moves it to disk. */
const GROUPING_MEMORY = 64 * 2 ** 20;

/** Validates the query against the scan's axes (400 naming each bad field) and plans its one read. */
export function planSlice(axes: ScanAxis[], q: ScanGridQuery, columns: SliceColumns): SlicePlan {
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
  const column = q.output === 'status' ? null : columns[q.output];
  const figures = column ? `, COUNT(${column}), SUM(${column}), MIN(${column}), MAX(${column})` : '';
  // MariaDB adds the points up per cell and status, so only the blocks cross the wire, not a million
  // rows. The group is one integer, cell · STATUS_KEYS + the status's place in POINT_STATUSES: a
  // narrow key keeps the temporary table small, and in memory up to GROUPING_MEMORY (a 512 × 512
  // slice with two statuses fits; past it MariaDB goes on on disk, slower, with the same answer).
  const sql = `SET STATEMENT tmp_memory_table_size = ${GROUPING_MEMORY}, max_heap_table_size = ${GROUPING_MEMORY} FOR
    SELECT (${cellOf(yi, y)} * ${x.values.length} + ${cellOf(xi, x)}) * ${STATUS_KEYS} + FIELD(status, ${POINT_STATUSES.map((s) => `'${s}'`).join(', ')}) AS k,
      COUNT(*)${figures}
    FROM scan_points WHERE scan_id = ? AND point_index BETWEEN ? AND ?${conditions.map((c) => ` AND ${c}`).join('')}
    GROUP BY k ORDER BY NULL`;
  return { x, y, at, output: q.output, valued: column !== null, sql, parameters: [first, last] };
}

function badRequest(fieldErrors: Record<string, string[]>) {
  return new BadRequestException({ message: Object.entries(fieldErrors).map(([k, v]) => `${k}: ${v.join('; ')}`).join('. '), fieldErrors });
}

/** One row of the aggregating SELECT: a cell's points of one status and, for an output, their figures. */
type CellRow = [key: number | string, points: number | string, valued?: number | string, sum?: number | null, min?: number | null, max?: number | null];

/** Runs the plan's SELECT for one scan and lays its rows out as the answer's columns. */
export async function readSlice(db: DataSource, scanId: number, plan: SlicePlan): Promise<ScanGridSlice> {
  const cells = plan.x.values.length * plan.y.values.length;
  const ok = new Array<number>(cells).fill(0);
  const failed = new Map<string, number[]>();
  const sum = new Float64Array(cells);
  const valued = new Float64Array(cells);
  const min: (number | null)[] = new Array(cells).fill(null);
  const max: (number | null)[] = new Array(cells).fill(null);
  const source = await openQueryStream(db, plan.sql, [scanId, ...plan.parameters], { rowsAsArray: true });
  let completed = false;
  try {
    for await (const [key, points, count, total, low, high] of source.readable as AsyncIterable<CellRow>) {
      // Integers may come as strings (the driver's big-number setting); the doubles come as numbers.
      const c = Math.floor(Number(key) / STATUS_KEYS);
      const status = POINT_STATUSES[(Number(key) % STATUS_KEYS) - 1] ?? 'unknown';
      if (status !== 'ok') {
        let counts = failed.get(status);
        if (!counts) failed.set(status, (counts = new Array<number>(cells).fill(0)));
        counts[c] += Number(points);
        continue;
      }
      ok[c] += Number(points);
      // An OK point has its outputs stored with its status; one without (never expected) is not averaged.
      if (!count) continue;
      valued[c] = Number(count);
      sum[c] = Number(total);
      min[c] = Number(low);
      max[c] = Number(high);
    }
    completed = true;
  } finally {
    await source.close(completed);
  }

  const slice: ScanGridSlice = { x: plan.x, y: plan.y, output: plan.output, ok, failed: Object.fromEntries(failed), at: plan.at };
  if (plan.valued) {
    slice.mean = Array.from({ length: cells }, (_, c) => (valued[c] ? roundForSlice(sum[c] / valued[c]) : null));
    if (plan.x.block * plan.y.block > 1) {
      slice.min = min.map((v) => (v === null ? null : roundForSlice(v)));
      slice.max = max.map((v) => (v === null ? null : roundForSlice(v)));
    }
  }
  return slice;
}
