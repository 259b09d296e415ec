import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { stringify } from 'csv-stringify';
import type { Response } from 'express';
import { Transform } from 'node:stream';
import type { DataSource, SelectQueryBuilder } from 'typeorm';
import {
  POINT_OUTPUTS, ScanGrid, sortedInput, variedInputs, type Page, type PointOutput, type PointSortKey, type ScanGridQuery, type ScanGridSlice,
  type ScanPlane, type ScanPlaneQuery, type ScanPointDto, type ScanPointsQuery,
} from '@sixtyfold/shared';
import type { SessionUser } from '../common/session-user';
import { ExportsService } from '../exports/exports.service';
import { openQueryStream } from '../exports/query-stream';
import { GroupAccessService } from '../groups/group-access.service';
import { Scan } from './entities/scan.entity';
import { ScanPoint } from './entities/scan-point.entity';

/** API output name → scan_points column. */
const COLUMN: Record<PointOutput | 'pointIndex', string> = {
  pointIndex: 'point_index', ns: 'ns', r: 'r', alphaS: 'alpha_s', As: 'a_s', amplitudeScale: 'amplitude_scale',
  nTotal: 'n_total', nStar: 'n_star', phiStar: 'phi_star', phiEnd: 'phi_end', energyScaleGeV: 'energy_scale_gev',
};

type RawPoint = Record<string, unknown>;

/**
 * An axis input as a number. Inputs are one JSON object per point; the name was checked against
 * the scan's axes and matches [A-Za-z][A-Za-z0-9_]*, so it is safe inside the JSON path.
 */
function inputExpression(name: string): string {
  return `CAST(JSON_VALUE(p.inputs, '$.${name}') AS DOUBLE)`;
}

function sortExpression(sort: PointSortKey): string {
  const input = sortedInput(sort);
  return input ? inputExpression(input) : `p.${COLUMN[sort as PointOutput | 'pointIndex']}`;
}

/** The JSON inputs column: MariaDB's JSON is text, which the driver may hand over unparsed. */
function inputsOf(raw: RawPoint): Record<string, number> {
  return typeof raw.inputs === 'string' ? JSON.parse(raw.inputs) : (raw.inputs as Record<string, number>);
}

function toDto(raw: RawPoint): ScanPointDto {
  const inputs = inputsOf(raw);
  const dto = { pointIndex: Number(raw.point_index), inputs, status: String(raw.status), failureReason: (raw.failure_reason as string) ?? null } as ScanPointDto;
  for (const o of POINT_OUTPUTS) {
    const v = raw[COLUMN[o]];
    dto[o] = v === null || v === undefined ? null : Number(v);
  }
  return dto;
}

/** A scan's stored points: pages, streamed exports and heatmap slices. */
@Injectable()
export class ScanResultsService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly access: GroupAccessService,
    private readonly exports: ExportsService,
  ) {}

  async readable(user: SessionUser, id: number): Promise<Scan> {
    const scan = await this.db.getRepository(Scan).findOneBy({ id });
    if (!scan) throw new NotFoundException('No such scan');
    await this.access.require(user, scan.groupId, 'viewer', 'scan');
    return scan;
  }

  /** The matching points, with `sort_key` selected so that any column (outputs or inputs) can order them. */
  private filtered(scan: Scan, q: ScanPointsQuery): SelectQueryBuilder<ScanPoint> {
    const axes = variedInputs(scan.spec);
    // Each refusal under the query key that named the input, as the schema's own refusals are.
    const bad: Record<string, string[]> = {};
    const noAxis = (name: string) => [`the scan has no axis ${name}; its axes are ${axes.join(', ')}`];
    const sorted = sortedInput(q.sort);
    if (sorted !== null && !axes.includes(sorted)) bad.sort = noAxis(sorted);
    for (const range of q.inputRanges.filter((r) => !axes.includes(r.name))) {
      for (const end of ['min', 'max'] as const) if (range[end] !== undefined) bad[`input.${range.name}_${end}`] = noAxis(range.name);
    }
    if (Object.keys(bad).length) throw new BadRequestException({ message: Object.entries(bad).map(([k, v]) => `${k}: ${v.join('; ')}`).join('. '), fieldErrors: bad });
    const qb = this.db
      .getRepository(ScanPoint)
      .createQueryBuilder('p')
      .select('p.*')
      .addSelect(sortExpression(q.sort), 'sort_key')
      .where('p.scan_id = :scanId', { scanId: scan.id });
    if (q.status === 'failed') qb.andWhere("p.status <> 'ok'");
    else if (q.status) qb.andWhere('p.status = :status', { status: q.status });
    q.ranges.forEach((range, i) => {
      if (range.min !== undefined) qb.andWhere(`p.${COLUMN[range.output]} >= :min${i}`, { [`min${i}`]: range.min });
      if (range.max !== undefined) qb.andWhere(`p.${COLUMN[range.output]} <= :max${i}`, { [`max${i}`]: range.max });
    });
    q.inputRanges.forEach((range, i) => {
      const value = inputExpression(range.name);
      if (range.min !== undefined) qb.andWhere(`${value} >= :inMin${i}`, { [`inMin${i}`]: range.min });
      if (range.max !== undefined) qb.andWhere(`${value} <= :inMax${i}`, { [`inMax${i}`]: range.max });
    });
    return qb
      .orderBy('sort_key', q.order === 'asc' ? 'ASC' : 'DESC')
      .addOrderBy('p.point_index', 'ASC');
  }

  async page(user: SessionUser, id: number, q: ScanPointsQuery): Promise<Page<ScanPointDto>> {
    const scan = await this.readable(user, id);
    const qb = this.filtered(scan, q);
    const total = await qb.clone().orderBy().getCount();
    const rows = await qb
      .offset((q.page - 1) * q.pageSize)
      .limit(q.pageSize)
      .getRawMany<RawPoint>();
    return { items: rows.map(toDto), total, page: q.page, pageSize: q.pageSize };
  }

  /** One point by index; 404 says whether the index is outside the grid or not computed yet. */
  async point(user: SessionUser, id: number, pointIndex: number): Promise<ScanPointDto> {
    const scan = await this.readable(user, id);
    if (pointIndex < 0 || pointIndex >= scan.totalPoints) {
      throw new NotFoundException(`point ${pointIndex} is outside the grid of ${scan.totalPoints} points (index 0 to ${scan.totalPoints - 1})`);
    }
    const [row] = await this.db.query<RawPoint[]>('SELECT * FROM scan_points WHERE scan_id = ? AND point_index = ?', [id, pointIndex]);
    if (!row) throw new NotFoundException(`point ${pointIndex} is not stored yet`);
    return toDto(row);
  }

  /**
   * Every matching point as CSV or JSON into `res`, streamed from MariaDB row by row, so that a
   * million points never sit in memory. Columns: point index, one per axis, status, reason, outputs.
   */
  async export(user: SessionUser, id: number, q: ScanPointsQuery, format: 'csv' | 'json', res: Response): Promise<void> {
    const scan = await this.readable(user, id);
    const axes = variedInputs(scan.spec);
    const [sql, parameters] = this.filtered(scan, q).getQueryAndParameters();
    const download = {
      headers: {
        'Content-Type': format === 'csv' ? 'text/csv; charset=utf-8' : 'application/json; charset=utf-8',
        'Content-Disposition': `attachment; filename="scan-${id}-points.${format}"`,
      },
      open: () => openQueryStream(this.db, sql, parameters),
    };
    const toPoint = new Transform({
      objectMode: true,
      transform(raw: RawPoint, _enc, done) {
        done(null, toDto(raw));
      },
    });
    if (format === 'csv') {
      // An output that is also an axis (N_* on an axis) is the same number: one column for it.
      const outputs = POINT_OUTPUTS.filter((o) => !axes.includes(o));
      const columns = ['pointIndex', ...axes, 'status', 'failureReason', ...outputs];
      const flatten = new Transform({
        objectMode: true,
        transform(p: ScanPointDto, _enc, done) {
          done(null, [p.pointIndex, ...axes.map((a) => p.inputs[a]), p.status, p.failureReason ?? '', ...outputs.map((o) => p[o] ?? '')]);
        },
      });
      return this.exports.send(user, res, { ...download, stages: [toPoint, flatten, stringify({ header: true, columns })] });
    }
    let first = true;
    const json = new Transform({
      writableObjectMode: true,
      transform(p: ScanPointDto, _enc, done) {
        done(null, `${first ? '[' : ','}\n${JSON.stringify(p)}`);
        first = false;
      },
      flush(done) {
        done(null, first ? '[]\n' : '\n]\n');
      },
    });
    return this.exports.send(user, res, { ...download, stages: [toPoint, json] });
  }

  /**
   * The OK points as columns for an n_s–r plot, at most `limit` of them. When there are more,
   * the OK points are numbered in point-index order (ROW_NUMBER over the (scan, status) index,
   * which holds the point index, so this reads no row) and every stride-th is kept with MOD;
   * the sample spreads evenly over the grid and only the kept rows are read in full, by primary
   * key. Count and sample come from one snapshot (a REPEATABLE READ transaction), so they agree
   * while a scan is still storing points.
   */
  async plane(user: SessionUser, id: number, q: ScanPlaneQuery): Promise<ScanPlane> {
    const scan = await this.readable(user, id);
    const parameters = variedInputs(scan.spec);
    const columns = 'p.point_index, p.ns, p.r, p.alpha_s, p.n_star, p.inputs';
    const { okPoints, stride, rows } = await this.db.transaction('REPEATABLE READ', async (tx) => {
      const [{ n }]: { n: string | number }[] = await tx.query("SELECT COUNT(*) AS n FROM scan_points WHERE scan_id = ? AND status = 'ok'", [id]);
      const okPoints = Number(n);
      const stride = Math.max(1, Math.ceil(okPoints / q.limit));
      let rows: RawPoint[] = [];
      if (okPoints > 0 && stride === 1) {
        rows = await tx.query(`SELECT ${columns} FROM scan_points p WHERE p.scan_id = ? AND p.status = 'ok' ORDER BY p.point_index`, [id]);
      } else if (okPoints > 0) {
        rows = await tx.query(
          `SELECT ${columns}
             FROM (SELECT point_index, ROW_NUMBER() OVER (ORDER BY point_index) AS k
                     FROM scan_points FORCE INDEX (ix_scan_points_scan_status)
                    WHERE scan_id = ? AND status = 'ok') ranked
             STRAIGHT_JOIN scan_points p ON p.scan_id = ? AND p.point_index = ranked.point_index
            WHERE MOD(ranked.k - 1, ?) = 0
            ORDER BY ranked.point_index`,
          [id, id, stride],
        );
      }
      return { okPoints, stride, rows };
    });
    // An OK point always has all four outputs: the worker stores them with the status.
    const plane: ScanPlane = {
      okPoints,
      stride,
      parameters,
      pointIndex: new Array(rows.length),
      ns: new Array(rows.length),
      r: new Array(rows.length),
      alphaS: new Array(rows.length),
      nStar: new Array(rows.length),
      inputs: Object.fromEntries(parameters.map((name) => [name, new Array<number>(rows.length)])),
    };
    rows.forEach((row, i) => {
      plane.pointIndex[i] = Number(row.point_index);
      plane.ns[i] = Number(row.ns);
      plane.r[i] = Number(row.r);
      plane.alphaS[i] = Number(row.alpha_s);
      plane.nStar[i] = Number(row.n_star);
      const inputs = inputsOf(row);
      for (const name of parameters) plane.inputs[name][i] = inputs[name];
    });
    return plane;
  }

  /**
   * Two axes as x and y, every other axis at the chosen index, as at most `maxCells` cells along
   * each axis: past that, blocks of points per cell (see scanGridSliceSchema). The window's points
   * lie between its first and last point index, so they come in one range read of the primary key
   * (contiguous rows when x and y are the scan's last two axes; otherwise the axis digits filter
   * the range), and are aggregated while they stream, so a million points never sit in memory.
   */
  async grid(user: SessionUser, id: number, q: ScanGridQuery): Promise<ScanGridSlice> {
    const scan = await this.readable(user, id);
    const spec = scan.spec;
    // A list's points have no neighbours to lay out in cells; the plane and the points serve it.
    if (!spec.axes) throw new ConflictException('This scan runs over a list of points, not a grid: it has no heatmap slices. Read its points or its n_s–r plane instead');
    const grid = new ScanGrid(spec.axes);
    const names = spec.axes.map((a) => a.parameter);
    const xi = names.indexOf(q.x);
    const yi = names.indexOf(q.y);
    const bad: Record<string, string[]> = {};
    if (xi < 0) bad.x = [`the scan has no axis ${q.x}; it has ${names.join(', ')}`];
    if (yi < 0) bad.y = [`the scan has no axis ${q.y}; it has ${names.join(', ')}`];
    if (xi >= 0 && xi === yi) bad.y = ['x and y must be different axes'];
    for (const [name, index] of Object.entries(q.at)) {
      const a = names.indexOf(name);
      if (a < 0) bad[`at.${name}`] = [`the scan has no axis ${name}`];
      else if (index >= grid.lengths[a]) bad[`at.${name}`] = [`${name} has ${grid.lengths[a]} values (index 0 to ${grid.lengths[a] - 1})`];
    }
    for (const [axis, a] of [['x', xi], ['y', yi]] as const) {
      for (const end of ['From', 'To'] as const) {
        const index = q[`${axis}${end}`];
        if (a >= 0 && index !== undefined && index >= grid.lengths[a]) bad[`${axis}${end}`] = [`${names[a]} has ${grid.lengths[a]} values (index 0 to ${grid.lengths[a] - 1})`];
      }
    }
    if (Object.keys(bad).length) {
      throw new BadRequestException({ message: Object.entries(bad).map(([k, v]) => `${k}: ${v.join('; ')}`).join('. '), fieldErrors: bad });
    }
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
    if (x.from > x.to) throw new BadRequestException({ message: `xTo: must not be below xFrom (${x.from})`, fieldErrors: { xTo: [`must not be below xFrom (${x.from})`] } });
    if (y.from > y.to) throw new BadRequestException({ message: `yTo: must not be below yFrom (${y.from})`, fieldErrors: { yTo: [`must not be below yFrom (${y.from})`] } });

    // Point index = Σ digit[a] · stride[a] (last axis fastest).
    const stride = grid.lengths.map((_, a) => grid.lengths.slice(a + 1).reduce((n, l) => n * l, 1));
    const first = grid.indexOf(names.map((_, a) => (a === xi ? x.from : a === yi ? y.from : cell[a])));
    const last = grid.indexOf(names.map((_, a) => (a === xi ? x.to : a === yi ? y.to : cell[a])));
    // Inside [first, last] only digits faster than the slower of x and y can stray from the slice.
    const slower = Math.max(stride[xi], stride[yi]);
    const digit = (a: number) => `(point_index DIV ${stride[a]}) MOD ${grid.lengths[a]}`;
    const conditions: string[] = [];
    names.forEach((_, a) => {
      if (stride[a] >= slower) return;
      if (a === xi) {
        if (x.from > 0 || x.to < x.length - 1) conditions.push(`${digit(a)} BETWEEN ${x.from} AND ${x.to}`);
      } else if (a === yi) {
        if (y.from > 0 || y.to < y.length - 1) conditions.push(`${digit(a)} BETWEEN ${y.from} AND ${y.to}`);
      } else conditions.push(`${digit(a)} = ${cell[a]}`);
    });
    const column = q.output === 'status' ? null : COLUMN[q.output];
    const sql = `SELECT point_index, status${column ? `, ${column} AS value` : ''} FROM scan_points
      WHERE scan_id = ? AND point_index BETWEEN ? AND ?${conditions.map((c) => ` AND ${c}`).join('')}`;

    const nx = x.values.length;
    const cells = nx * y.values.length;
    const sum = new Float64Array(cells);
    const min = new Float64Array(cells).fill(Infinity);
    const max = new Float64Array(cells).fill(-Infinity);
    const ok = new Array<number>(cells).fill(0);
    const valued = new Uint32Array(cells);
    const failed = new Map<string, number[]>();
    // Rows as arrays: a million of them cost no object each.
    const source = await openQueryStream(this.db, sql, [id, first, last], { rowsAsArray: true });
    let completed = false;
    try {
      for await (const [pointIndex, status, value] of source.readable as AsyncIterable<[number, string, (number | null)?]>) {
        const index = Number(pointIndex);
        const ix = (Math.floor(index / stride[xi]) % x.length - x.from) / x.block;
        const iy = (Math.floor(index / stride[yi]) % y.length - y.from) / y.block;
        const c = Math.floor(iy) * nx + Math.floor(ix);
        if (status !== 'ok') {
          let counts = failed.get(status);
          if (!counts) failed.set(status, (counts = new Array<number>(cells).fill(0)));
          counts[c]++;
          continue;
        }
        ok[c]++;
        // An OK point has its outputs stored with its status; one without (never expected) is not averaged.
        if (value === null || value === undefined) continue;
        valued[c]++;
        sum[c] += value;
        if (value < min[c]) min[c] = value;
        if (value > max[c]) max[c] = value;
      }
      completed = true;
    } finally {
      await source.close(completed);
    }

    const slice: ScanGridSlice = { x, y, output: q.output, ok, failed: Object.fromEntries(failed), at };
    if (column) {
      slice.mean = Array.from({ length: cells }, (_, c) => (valued[c] ? sum[c] / valued[c] : null));
      if (x.block * y.block > 1) {
        slice.min = Array.from({ length: cells }, (_, c) => (valued[c] ? min[c] : null));
        slice.max = Array.from({ length: cells }, (_, c) => (valued[c] ? max[c] : null));
      }
    }
    return slice;
  }
}
