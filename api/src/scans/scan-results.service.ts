import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { Response } from 'express';
import type { DataSource, SelectQueryBuilder } from 'typeorm';
import {
  FINISHED_SCAN_STATUSES, inputSortedOrder, planeSample, ENGINE_PIVOT_PER_MPC, rSigma, type LikelihoodSet, POINT_OUTPUTS, ScanGrid, scanPoints, sortedInput, variedInputs, type PointExportFormat, type PointOutput, type ScanGridQuery, type ScanGridSlice,
  type ScanPlane, type ScanPlaneQuery, type ScanPointDto, type ScanPointPage, type ScanPointsQuery, type ScanProvenanceAnswer,
} from '@sixtyfold/shared';
import type { SessionUser } from '../common/session-user';
import { ExportsService } from '../exports/exports.service';
import { openQueryStream } from '../exports/query-stream';
import { GroupAccessService } from '../groups/group-access.service';
import { LikelihoodsService, type ResolvedLikelihood } from '../likelihoods/likelihoods.service';
import { GridIndexSql } from './grid-index-sql';
import { Scan } from './entities/scan.entity';
import { AXIS_COLUMNS, ScanPoint } from './entities/scan-point.entity';
import { GridSliceCache } from './grid-slice-cache';
import { planSlice, readSlices, type SliceColumns } from './grid-slice';
import { EXPORT_CONTENT_TYPES, ExportColumns, exportSelect, exportStages, type ExportAbout } from './point-export-formats';
import { provenanceLines, readScanProvenance } from './scan-provenance';

/** API output name → scan_points column. */
const COLUMN: Record<PointOutput | 'pointIndex', string> = {
  pointIndex: 'point_index', ns: 'ns', r: 'r', alphaS: 'alpha_s', As: 'a_s', amplitudeScale: 'amplitude_scale',
  nTotal: 'n_total', nStar: 'n_star', phiStar: 'phi_star', phiEnd: 'phi_end', energyScaleGeV: 'energy_scale_gev',
};

type RawPoint = Record<string, unknown>;

/** Statuses whose points stay as they are until a retry reopens the scan. */
/**
 * Cells of finished scans' slices kept in this process: about 90 bytes each as answer objects, so
 * at most about 35 MB; two views of the page's 200 × 200 panels (n_s, r, α_s and the counts), or
 * one full-width 512 × 512.
 */
const KEPT_SLICE_CELLS = 400_000;
/**
 * Outputs read with any other at the same cells: the page's first panels (n_s, r, α_s; the counts
 * come with them). Each adds its aggregates to the one read (about +25% each on 10^6 points) rather
 * than a read of its own; a live page's panels, asked at the same moments, keep sharing reads.
 */
const READ_TOGETHER: ScanGridQuery['output'][] = ['ns', 'r', 'alphaS', 'status'];

/**
 * An axis input as a number: its own indexed column `axis_k` for the first AXIS_COLUMNS varied
 * inputs, else (a point list's later columns) from the JSON inputs. The name was checked against
 * the scan's inputs and matches [A-Za-z][A-Za-z0-9_]*, so it is safe inside the JSON path.
 */
function inputExpression(parameters: string[], name: string): string {
  const k = parameters.indexOf(name);
  return k >= 0 && k < AXIS_COLUMNS ? `p.axis_${k}` : `CAST(JSON_VALUE(p.inputs, '$.${name}') AS DOUBLE)`;
}

/**
 * The column (or expression) a page sorts by, and the direction of it and of the point-index
 * tie-break. An input of a grid sorts by its index in the point index where that orders it (`GridIndexSql`).
 */
function orderOf(
  parameters: string[],
  q: Pick<ScanPointsQuery, 'sort' | 'order'>,
  set?: LikelihoodSet,
  grid?: GridIndexSql | null,
): { expression: string; direction: 'ASC' | 'DESC' } {
  const input = sortedInput(q.sort);
  const expression = input
    ? (grid?.sortKey(parameters.indexOf(input)) ?? inputExpression(parameters, input))
    : q.sort === 'deltaChi2'
      ? deltaChi2Sql(set!)
      : `p.${COLUMN[q.sort as PointOutput | 'pointIndex']}`;
  return { expression, direction: q.order === 'asc' ? 'ASC' : 'DESC' };
}

/**
 * A point's Δχ² under `set` in SQL, for sorting and filtering: the same sum as the shared
 * `deltaChi2` (a point with r < 0 sorts last, as +Infinity there; a failed point is NULL). The set's
 * numbers were checked finite by its schema, so they are written in as literals.
 */
function deltaChi2Sql(set: LikelihoodSet, table = 'p'): string {
  const n = (x: number) => `(${x})`;
  const ratio = set.r.pivotPerMpc / ENGINE_PIVOT_PER_MPC;
  // r at the set's pivot, as `rAtSetPivot` moves it.
  const [ns, rAtK, alphaS] = ['ns', 'r', 'alpha_s'].map((column) => `${table}.${column}`);
  const r = ratio === 1 ? rAtK : `${rAtK} * POW(${n(ratio)}, -${rAtK} / 8 - (${ns} - 1))`;
  const terms = [`POW((${ns} - ${n(set.ns.mean)}) / ${n(set.ns.sigma)}, 2)`, `IF(${rAtK} < 0, 1e308, POW(${r} / ${n(rSigma(set))}, 2))`];
  if (set.alphaS) terms.push(`IF(${alphaS} IS NULL, 0, POW((${alphaS} - ${n(set.alphaS.mean)}) / ${n(set.alphaS.sigma)}, 2))`);
  return `(${terms.join(' + ')})`;
}

/** A grid scan read alone has its inputs in the point index; a point list, or several scans read as one, has them in columns. */
function gridIndexSql(scan: Scan, scanIds: number[]): GridIndexSql | null {
  return scan.spec.axes && scanIds.length === 1 ? new GridIndexSql(new ScanGrid(scan.spec.axes)) : null;
}

/** The JSON inputs column: MariaDB's JSON is text, which the driver may hand over unparsed. */
function inputsOf(raw: RawPoint): Record<string, number> {
  return typeof raw.inputs === 'string' ? JSON.parse(raw.inputs) : (raw.inputs as Record<string, number>);
}

/** A point as the API gives it; with a likelihood, its Δχ² and confidence level (and, under uploaded regions, whether it lies outside them). */
/** A stored row as the API answers it (inputs, status, outputs; Δχ² under a likelihood). */
export function toDto(raw: RawPoint, likelihood?: ResolvedLikelihood): ScanPointDto {
  const inputs = inputsOf(raw);
  const dto = { pointIndex: Number(raw.point_index), inputs, status: String(raw.status), failureReason: (raw.failure_reason as string) ?? null } as ScanPointDto;
  for (const o of POINT_OUTPUTS) {
    const v = raw[COLUMN[o]];
    dto[o] = v === null || v === undefined ? null : Number(v);
  }
  if (likelihood) {
    const judged = likelihood.judge(dto);
    dto.deltaChi2 = judged?.deltaChi2 ?? null;
    dto.confidence = judged?.confidence ?? null;
    if (likelihood.description.kind === 'regions') dto.outsideRegions = judged?.outsideRegions ?? null;
  }
  return dto;
}

/** Every point of the scan is stored (a point list or grid computed to its end). */
function complete(scan: Scan): boolean {
  return scan.donePoints + scan.failedPoints === scan.totalPoints;
}

/** How many points of a complete grid lie inside these input ranges: the product over the axes of the values inside. */
function inputRangeCount(grid: ScanGrid, ranges: ScanPointsQuery['inputRanges']): number {
  return grid.axes.reduce((n, axis, a) => {
    const range = ranges.filter((r) => r.name === axis.parameter);
    const inside = grid.values[a].filter((v) => range.every((r) => (r.min === undefined || v >= r.min) && (r.max === undefined || v <= r.max)));
    return n * inside.length;
  }, 1);
}

/** A scan's stored points: pages, streamed exports and heatmap slices. */
@Injectable()
export class ScanResultsService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly access: GroupAccessService,
    private readonly exports: ExportsService,
    private readonly likelihoods: LikelihoodsService,
  ) {}

  private readonly slices = new GridSliceCache(KEPT_SLICE_CELLS);
  /** Slice reads under way, by scan and cells: a request for an output one of them reads waits for it. */
  private readonly reading = new Map<string, { outputs: ScanGridQuery['output'][]; slices: Promise<Map<ScanGridQuery['output'], ScanGridSlice>> }>();

  async readable(user: SessionUser, id: number): Promise<Scan> {
    const scan = await this.db.getRepository(Scan).findOneBy({ id });
    if (!scan) throw new NotFoundException('No such scan');
    await this.access.require(user, scan.groupId, 'viewer', 'scan');
    return scan;
  }

  /**
   * The matching points of `scanIds` (the scan alone by default) in the asked order; `scan`'s spec
   * names the inputs, so every scan read must store them in the same `axis_k` columns (a refinement
   * level's point list has its parent's axes as columns, in order). For one scan, ties go by point
   * index in the same direction (so each order is one walk of a (scan_id, column) index, whose
   * entries end in the point index). Across scans, ties go by scan in the order of `scanIds`, then
   * point index, and `pointIndex` sorts by that tie-break alone (a point index names a point only
   * within its scan). The sort key is selected first, on purpose: TypeORM would move a sort
   * expression that names an entity column (`p.ns`) ahead of the others, and exports read their
   * rows by position.
   */
  private filtered(scan: Scan, q: ScanPointsQuery, select = 'p.*', set?: LikelihoodSet, scanIds: number[] = [scan.id]): SelectQueryBuilder<ScanPoint> {
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
    const grid = gridIndexSql(scan, scanIds);
    const qb = this.db
      .getRepository(ScanPoint)
      .createQueryBuilder('p')
      .select(`${orderOf(axes, q, set, grid).expression} AS sort_key, ${select}`);
    if (scanIds.length === 1) qb.where('p.scan_id = :scanId', { scanId: scanIds[0] });
    else qb.where('p.scan_id IN (:...scanIds)', { scanIds });
    if (q.status === 'failed') qb.andWhere("p.status <> 'ok'");
    else if (q.status) qb.andWhere('p.status = :status', { status: q.status });
    q.ranges.forEach((range, i) => {
      if (range.min !== undefined) qb.andWhere(`p.${COLUMN[range.output]} >= :min${i}`, { [`min${i}`]: range.min });
      if (range.max !== undefined) qb.andWhere(`p.${COLUMN[range.output]} <= :max${i}`, { [`max${i}`]: range.max });
    });
    q.inputRanges.forEach((range, i) => {
      if (grid) {
        qb.andWhere(grid.range(axes.indexOf(range.name), range.min, range.max));
        return;
      }
      const value = inputExpression(axes, range.name);
      if (range.min !== undefined) qb.andWhere(`${value} >= :inMin${i}`, { [`inMin${i}`]: range.min });
      if (range.max !== undefined) qb.andWhere(`${value} <= :inMax${i}`, { [`inMax${i}`]: range.max });
    });
    if (q.deltaChi2Max !== undefined) qb.andWhere(`${deltaChi2Sql(set!)} <= :deltaChi2Max`, { deltaChi2Max: q.deltaChi2Max });
    const { expression, direction } = orderOf(axes, q, set, grid);
    if (scanIds.length === 1) return qb.orderBy(expression, direction).addOrderBy('p.point_index', direction);
    // The ids are integers read from the database, so they are written in as literals.
    const chainOrder = `FIELD(p.scan_id, ${scanIds.map(Number).join(', ')})`;
    if (q.sort === 'pointIndex') qb.orderBy(chainOrder, direction);
    else qb.orderBy(expression, direction).addOrderBy(chainOrder, direction);
    return qb.addOrderBy('p.point_index', direction);
  }

  /** How many rows a query builder matches. */
  private async count(matching: SelectQueryBuilder<ScanPoint>): Promise<number> {
    const [sql, parameters] = matching.clone().select('1').orderBy().getQueryAndParameters();
    const [{ n }]: { n: string | number }[] = await this.db.query(`SELECT COUNT(*) AS n FROM (${sql}) matching`, parameters);
    return Number(n);
  }

  /**
   * One page by a deferred join: the inner query walks the sort column's index for the page's
   * point indices alone (the offset skips index entries, not rows), and only the page's rows are
   * then read by primary key. Without filters the total is the scan's own counters.
   */
  async page(user: SessionUser, id: number, q: ScanPointsQuery): Promise<ScanPointPage> {
    const scan = await this.readable(user, id);
    const likelihood = q.likelihood && (await this.likelihoods.resolve(user, q.likelihood));
    // Only a set sorts and filters by Δχ² (in SQL); the schema refuses both under uploaded regions.
    const set = likelihood?.set;
    // Built first: it refuses an input the scan does not vary, whatever the page.
    const matching = this.filtered(scan, q, 'p.*', set);
    const unfiltered = !q.ranges.length && !q.inputRanges.length && q.deltaChi2Max === undefined;
    let total: number;
    if (unfiltered && !q.status) total = scan.donePoints + scan.failedPoints;
    else if (unfiltered && q.status === 'ok') total = scan.donePoints;
    else if (unfiltered && q.status === 'failed') total = scan.failedPoints;
    else if (!q.status && !q.ranges.length && q.deltaChi2Max === undefined && complete(scan) && scan.spec.axes) total = inputRangeCount(new ScanGrid(scan.spec.axes), q.inputRanges);
    else total = await this.count(matching);
    // Past the last page there is nothing to read (and a LIMIT of 0 would mean none to TypeORM).
    const rows: RawPoint[] =
      (q.page - 1) * q.pageSize >= total ? [] : ((await this.inputOrderedPage(scan, q)) ?? (await this.db.query(...this.pageQuery(scan, q, total, set))));
    return { items: rows.map((row) => toDto(row, likelihood)), total, page: q.page, pageSize: q.pageSize, ...(likelihood && { judgedBy: likelihood.description.ref }) };
  }

  /**
   * One page of the points of several scans read as one table (a refined grid and its levels,
   * `scanIds` in the chain's order), sorted and filtered as `page` does; `scan`'s spec names the
   * inputs. A plain LIMIT/OFFSET over the matching rows: a chain is small (a refinable grid and
   * levels of at most POINT_LIST_MAX_POINTS points), so `page`'s index walks are not needed.
   */
  async pageOfScans(user: SessionUser, scan: Scan, scanIds: number[], q: ScanPointsQuery): Promise<{ rows: RawPoint[]; total: number; likelihood?: ResolvedLikelihood }> {
    const likelihood = q.likelihood ? await this.likelihoods.resolve(user, q.likelihood) : undefined;
    const matching = this.filtered(scan, q, 'p.*', likelihood?.set, scanIds);
    const total = await this.count(matching);
    // Past the last page there is nothing to read (and a LIMIT of 0 would mean none to TypeORM).
    const rows: RawPoint[] = (q.page - 1) * q.pageSize >= total ? [] : await this.db.query(...matching.offset((q.page - 1) * q.pageSize).limit(q.pageSize).getQueryAndParameters());
    return { rows, total, likelihood };
  }

  /**
   * A page of a complete grid sorted by an axis input and not filtered: its point indices follow
   * from the axes (`inputSortedOrder`), so it is read by primary key with no sort at all. Null
   * where that does not hold (a filter, a point list, missing points, an axis repeating a value):
   * the SQL page serves those.
   */
  private async inputOrderedPage(scan: Scan, q: ScanPointsQuery): Promise<RawPoint[] | null> {
    const input = sortedInput(q.sort);
    const axes = scan.spec.axes;
    const filtered = q.status || q.ranges.length || q.inputRanges.length || q.deltaChi2Max !== undefined;
    if (!input || !axes || filtered || !complete(scan)) return null;
    const grid = new ScanGrid(axes);
    const pointAt = inputSortedOrder(grid, axes.findIndex((a) => a.parameter === input));
    if (!pointAt) return null;
    const first = (q.page - 1) * q.pageSize;
    const count = Math.min(q.pageSize, grid.size - first);
    const indices = Array.from({ length: count }, (_, k) => (q.order === 'asc' ? pointAt(first + k) : pointAt(grid.size - 1 - first - k)));
    const rows: RawPoint[] = await this.db.query('SELECT * FROM scan_points WHERE scan_id = ? AND point_index IN (?)', [scan.id, indices]);
    const byIndex = new Map(rows.map((row) => [Number(row.point_index), row]));
    return indices.map((i) => byIndex.get(i)).filter((row) => row !== undefined);
  }

  /**
   * The SQL of one page (see `page`) of `total` matching points, and its parameters. A page past
   * the middle is taken from the far end (the order reversed, the offset counted from the end),
   * so the index walk covers at most half of the matching points.
   */
  pageQuery(scan: Scan, q: ScanPointsQuery, total: number, set?: LikelihoodSet): [string, unknown[]] {
    const offset = (q.page - 1) * q.pageSize;
    const fromEnd = offset > total / 2;
    const inner = fromEnd
      ? this.filtered(scan, { ...q, order: q.order === 'asc' ? 'desc' : 'asc' }, 'p.*', set).offset(Math.max(0, total - offset - q.pageSize)).limit(Math.max(0, Math.min(q.pageSize, total - offset)))
      : this.filtered(scan, q, 'p.*', set).offset(offset).limit(q.pageSize);
    const [innerSql, parameters] = inner.select('p.point_index', 'point_index').getQueryAndParameters();
    const { expression, direction } = orderOf(variedInputs(scan.spec), q, set, gridIndexSql(scan, [scan.id]));
    const sql = `SELECT p.* FROM (${innerSql}) page STRAIGHT_JOIN scan_points p ON p.scan_id = ? AND p.point_index = page.point_index
      ORDER BY ${expression} ${direction}, p.point_index ${direction}`;
    return [sql, [...parameters, scan.id]];
  }

  /** What computed the scan: its submission record and the workers that stored its chunks. */
  async provenance(user: SessionUser, id: number): Promise<ScanProvenanceAnswer> {
    return readScanProvenance(this.db.manager, await this.readable(user, id));
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
   * Every matching point as CSV, JSON or Apache Arrow (IPC stream) into `res`, streamed from MariaDB
   * as row arrays, so that a million points never sit in memory. Columns: point index, one per axis,
   * status, reason, outputs (see `point-export-formats.ts`).
   */
  async export(user: SessionUser, id: number, q: ScanPointsQuery, format: PointExportFormat, res: Response): Promise<void> {
    const scan = await this.readable(user, id);
    const likelihood = q.likelihood && (await this.likelihoods.resolve(user, q.likelihood));
    const columns = new ExportColumns(variedInputs(scan.spec), likelihood?.judge);
    const [sql, parameters] = this.filtered(scan, q, exportSelect(COLUMN), likelihood?.set).getQueryAndParameters();
    const provenance = await readScanProvenance(this.db.manager, scan);
    const judgedBy = likelihood ? likelihood.description.ref : undefined;
    const about: ExportAbout = {
      lines: [`sixtyfold scan ${scan.id}: ${scan.name}`, ...provenanceLines(provenance), ...(judgedBy ? [`judged by: ${judgedBy}`] : [])],
      metadata: { scanId: String(scan.id), provenance: JSON.stringify(provenance), ...(judgedBy && { judgedBy }) },
    };
    return this.exports.send(user, res, {
      headers: {
        // Every format: the submission record here (the JSON array itself is unchanged), the full record at the link.
        'X-Sixtyfold-Provenance': JSON.stringify(provenance.recorded),
        Link: `</api/scans/${scan.id}/provenance>; rel="describedby"`,
        'Content-Type': EXPORT_CONTENT_TYPES[format],
        // A judged export names its likelihood, version included, in its file name and a header.
        'Content-Disposition': `attachment; filename="scan-${id}-points${likelihood ? `-judged-${likelihood.description.ref.replace(/[^a-z0-9.-]+/gi, '-')}` : ''}.${format}"`,
        ...(likelihood && { 'X-Sixtyfold-Judged-By': likelihood.description.ref }),
      },
      open: () => openQueryStream(this.db, sql, parameters, { rowsAsArray: true }),
      stages: exportStages(format, columns, about),
    });
  }

  /**
   * The OK points as columns for an n_s–r plot, from at most `limit` points of the scan. When
   * the scan has more, it is sampled evenly as a sub-grid (`planeSample`: every s-th value of each
   * axis, or of a point list's order) and only the sampled points are read, by primary key; the
   * answer states the steps. The OK count and the sample come from one snapshot (a REPEATABLE
   * READ transaction), so they agree while a scan is still storing points.
   */
  async plane(user: SessionUser, id: number, q: ScanPlaneQuery): Promise<ScanPlane> {
    const scan = await this.readable(user, id);
    const parameters = variedInputs(scan.spec);
    const lengths = scan.spec.axes ? new ScanGrid(scan.spec.axes).lengths : [scanPoints(scan.spec).size];
    const { axisStrides, pointIndices } = planeSample(lengths, q.limit);
    const stride = axisStrides.reduce((product, step) => product * step, 1);
    const columns = 'point_index, ns, r, alpha_s, n_star, inputs';
    const { okPoints, rows } = await this.db.transaction('REPEATABLE READ', async (tx) => {
      // The scan's counter of OK points, which the worker moves in the transaction that stores them.
      const [{ done }]: { done: string | number }[] = await tx.query('SELECT done_points AS done FROM scans WHERE id = ?', [id]);
      const rows: RawPoint[] = [];
      if (stride === 1) {
        rows.push(...(await tx.query(`SELECT ${columns} FROM scan_points WHERE scan_id = ? AND status = 'ok' ORDER BY point_index`, [id])));
      } else {
        for (let i = 0; i < pointIndices.length; i += 5000) {
          const batch = pointIndices.slice(i, i + 5000);
          rows.push(...(await tx.query(
            `SELECT ${columns} FROM scan_points WHERE scan_id = ? AND point_index IN (${batch.map(() => '?').join(',')}) AND status = 'ok' ORDER BY point_index`,
            [id, ...batch],
          )));
        }
      }
      return { okPoints: Number(done), rows };
    });
    // An OK point always has all four outputs: the worker stores them with the status.
    const plane: ScanPlane = {
      okPoints,
      stride,
      axisStrides,
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
   * lie between its first and last point index, so MariaDB reads them in one range of the primary
   * key and adds them up per cell (`planSlice`, `readSlices`). The slices of READ_TOGETHER at the
   * same cells come from the same read: the page asks for n_s, r and a third output at once, and a
   * request for an output a read under way covers waits for it. A finished scan's slices are kept
   * (`GridSliceCache`).
   */
  async grid(user: SessionUser, id: number, q: ScanGridQuery): Promise<ScanGridSlice> {
    const scan = await this.readable(user, id);
    // A list's points have no neighbours to lay out in cells; the plane and the points serve it.
    if (!scan.spec.axes) throw new ConflictException('This scan runs over a list of points, not a grid: it has no heatmap slices. Read its points or its n_s–r plane instead');
    const plan = planSlice(scan.spec.axes, q);
    // Δχ² under the set is one more column to average, written out in SQL (the schema asks a set for it,
    // and refuses uploaded regions, which are judged per point outside the database).
    const set = q.likelihood ? (await this.likelihoods.resolve(user, q.likelihood)).set : undefined;
    const columns: SliceColumns = { ...COLUMN, deltaChi2: set ? deltaChi2Sql(set, 'scan_points') : 'NULL' };
    // A live scan's points are still coming; a finished one's change only by a retry, which reopens it.
    const finished = FINISHED_SCAN_STATUSES.has(scan.status);
    const keyOf = (output: ScanGridQuery['output']) => JSON.stringify([scan.id, scan.status, scan.finishedAt?.getTime() ?? null, { ...q, output }]);
    const kept = finished ? this.slices.get(keyOf(q.output)) : undefined;
    if (kept) return kept;
    const cells = keyOf('status');
    const pending = this.reading.get(cells);
    if (pending?.outputs.includes(q.output)) return (await pending.slices).get(q.output)!;
    // Companions only while all of them fit in the cache several times over (a full-width slice comes alone).
    const together = plan.x.values.length * plan.y.values.length * READ_TOGETHER.length <= KEPT_SLICE_CELLS / 2;
    // The asked output last, so that it is the most recent in the cache.
    const outputs = [...(together ? READ_TOGETHER.filter((output) => output !== q.output) : []), q.output];
    const slices = readSlices(this.db, scan.id, plan, outputs, columns);
    this.reading.set(cells, { outputs, slices });
    try {
      const read = await slices;
      if (finished) for (const [output, slice] of read) this.slices.set(keyOf(output), slice);
      return read.get(q.output)!;
    } finally {
      if (this.reading.get(cells)?.slices === slices) this.reading.delete(cells);
    }
  }
}
