import { BadRequestException, ConflictException, Injectable, Logger, type OnApplicationBootstrap, type OnApplicationShutdown } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import {
  boundaryDistance, createScanSchema, FINISHED_SCAN_STATUSES, judgeBySet, likelihoodRefSchema, nodeKey, POINT_LIST_MAX_POINTS, refinedCells, RefinementLattice,
  RefinementMesh, roundForSlice, ScanGrid, type RefinedCell, type ScanGridQuery, type ScanGridSlice,
  type CreateScan, type NextLevel, type PointOutput, type RefinedPointPage, type RefinementBoundary, type RefinementEstimate, type RefineScan, type ScanDetail,
  type ScanLineage, type ScanPointsQuery, type ScanRefinement,
} from '@sixtyfold/shared';
import { AuditService } from '../audit/audit.service';
import type { SessionUser } from '../common/session-user';
import type { AppConfig } from '../config/app.config';
import { GroupAccessService } from '../groups/group-access.service';
import { LikelihoodSetsService } from '../likelihoods/likelihood-sets.service';
import { ScheduledRunsService } from '../scheduling/scheduled-runs.service';
import { Scan } from './entities/scan.entity';
import { ScanResultsService, toDto } from './scan-results.service';
import { ScansService } from './scans.service';

/** API output name → scan_points column, for an output boundary. */
const OUTPUT_COLUMN: Record<PointOutput, string> = {
  ns: 'ns', r: 'r', alphaS: 'alpha_s', As: 'a_s', amplitudeScale: 'amplitude_scale', nTotal: 'n_total', nStar: 'n_star',
  phiStar: 'phi_star', phiEnd: 'phi_end', energyScaleGeV: 'energy_scale_gev',
};

/** A parent grid and the completed levels of one of its chains, with every node's value on the finest lattice. */
export interface MergedChain {
  parent: Scan;
  levels: Scan[];
  mesh: RefinementMesh;
  /** The chain's settings (from its first level). */
  refinement: ScanRefinement;
}

/** Reads a point row's value for the boundary: Δχ² under the pinned set, or the output. */
type PointValue = (row: { ns: number | null; r: number | null; alpha_s: number | null; value: number | null }) => number | null;

/**
 * Adaptive refinement (`shared/src/refinement/`): follow-up scans that split only the cells of a
 * finished grid scan that a boundary crosses, one scan per level, chained here as levels finish,
 * and the merged mesh the constraints read. See DEVELOPERS.md, "Refinement".
 */
@Injectable()
export class ScanRefinementsService implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger('ScanRefinements');
  private timer: NodeJS.Timeout | undefined;
  private following = false;

  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly scans: ScansService,
    private readonly results: ScanResultsService,
    private readonly access: GroupAccessService,
    private readonly sets: LikelihoodSetsService,
    private readonly audit: AuditService,
    private readonly config: ConfigService,
    private readonly runs: ScheduledRunsService,
  ) {}

  onApplicationBootstrap(): void {
    // The reconciler's interval: a finished level is followed at most that long after it finishes.
    const seconds = this.config.getOrThrow<AppConfig>('app').reconcileIntervalSeconds;
    void this.followFinishedLevels();
    if (seconds > 0) this.timer = this.runs.every('refinement-follow', seconds * 1000, () => this.followFinishedLevels());
  }

  onApplicationShutdown(): void {
    clearInterval(this.timer);
  }

  /** The first level's points and its run time at the parent's measured pace, before launch. */
  async estimate(user: SessionUser, id: number, q: RefineScan): Promise<RefinementEstimate> {
    const parent = await this.results.readable(user, id);
    const { lattice, next } = await this.plan(parent, q);
    const elapsed = parent.startedAt && parent.finishedAt ? (parent.finishedAt.getTime() - parent.startedAt.getTime()) / 1000 : 0;
    const pointsPerSecond = elapsed > 0 ? (parent.donePoints + parent.failedPoints) / elapsed : null;
    return {
      level: 1,
      cells: lattice.lengths(0).reduce((n, l) => n * (l - 1), 1),
      crossedCells: next.cells.length,
      points: next.nodes.length,
      parentPoints: parent.totalPoints,
      pointsPerSecond,
      seconds: pointsPerSecond ? next.nodes.length / pointsPerSecond : null,
      finestLengths: lattice.lengths(lattice.depth),
    };
  }

  /** Creates the first level of a chain on a completed grid scan (the member role in its group). */
  async refine(user: SessionUser, id: number, q: RefineScan): Promise<ScanDetail> {
    const parent = await this.results.readable(user, id);
    await this.access.require(user, parent.groupId, 'member', 'scan');
    const { lattice, boundary, next } = await this.plan(parent, q);
    const block: ScanRefinement = {
      parentScanId: parent.id, boundary, factors: lattice.axes.map((axis) => axis.factor), depth: lattice.depth, level: 1, cells: next.cells, lattice: next.nodes,
    };
    const levelId = await this.scans.submit(user.id, this.levelSpec(parent, block, lattice), { block, followsScanId: parent.id });
    await this.audit.record({
      action: 'scan.refine', actorId: user.id, groupId: parent.groupId, targetType: 'scan', targetId: parent.id,
      details: { levelScanId: levelId, boundary, factors: block.factors, depth: block.depth, points: next.nodes.length },
    });
    return this.scans.get(user, levelId);
  }

  /** A scan's lineage: the chain it belongs to, or the chains refining it. */
  async lineage(user: SessionUser, id: number): Promise<ScanLineage> {
    const scan = await this.results.readable(user, id);
    const parentId = scan.refinesScanId ?? scan.id;
    const levels = await this.db.getRepository(Scan).find({
      where: { refinesScanId: parentId }, order: { id: 'ASC' },
      select: { id: true, name: true, status: true, totalPoints: true, refinementLevel: true, refinementFollowedAt: true },
    });
    return {
      parentScanId: scan.refinementLevel === null ? null : scan.refinesScanId,
      level: scan.refinementLevel,
      levels: levels.map((s) => ({ scanId: s.id, level: s.refinementLevel ?? 0, name: s.name, status: s.status, totalPoints: s.totalPoints })),
      chaining: levels.some((s) => FINISHED_SCAN_STATUSES.has(s.status) && s.refinementFollowedAt === null),
    };
  }

  /**
   * Follows every finished level not yet followed: when it completed below its depth, the next
   * level is made from the merged mesh (parent and all levels so far), unless no cell is crossed.
   * Each level is claimed first by a conditional UPDATE, so one process follows it, once.
   */
  async followFinishedLevels(): Promise<number> {
    if (this.following) return 0;
    this.following = true;
    let created = 0;
    try {
      const finished: { id: number }[] = await this.db.query(
        `SELECT id FROM scans WHERE refinement_level IS NOT NULL AND refinement_followed_at IS NULL AND status IN ('completed', 'failed', 'cancelled') ORDER BY id LIMIT 50`,
      );
      for (const { id } of finished) {
        const claim: { affectedRows: number } = await this.db.query('UPDATE scans SET refinement_followed_at = CURRENT_TIMESTAMP(3) WHERE id = ? AND refinement_followed_at IS NULL', [id]);
        if (claim.affectedRows !== 1) continue;
        try {
          if (await this.follow(id)) created++;
        } catch (err) {
          // Released so that a later pass tries again (a database or queue hiccup).
          await this.db.query('UPDATE scans SET refinement_followed_at = NULL WHERE id = ?', [id]);
          this.logger.warn(`following refinement level ${id} failed, will try again: ${(err as Error).message}`);
        }
      }
    } catch (err) {
      this.logger.warn(`following refinement levels failed, will try again: ${(err as Error).message}`);
    } finally {
      this.following = false;
    }
    return created;
  }

  /** The chain a scan's merged views read: its own (for a level), else its newest chain with a completed level; null without one. */
  async mergedChain(scan: Scan): Promise<MergedChain | null> {
    const repo = this.db.getRepository(Scan);
    let parent: Scan | null = scan;
    let first: Scan | null;
    if (scan.refinementLevel !== null) {
      parent = scan.refinesScanId === null ? null : await repo.findOneBy({ id: scan.refinesScanId });
      first = scan;
      while (first && first.refinementLevel !== null && first.refinementLevel > 1) first = first.followsScanId === null ? null : await repo.findOneBy({ id: first.followsScanId });
    } else {
      first = await repo.findOne({ where: { followsScanId: scan.id, refinementLevel: 1, status: 'completed' }, order: { id: 'DESC' } });
    }
    if (!parent?.spec.axes || !first?.spec.refinement) return null;
    const levels: Scan[] = [];
    for (let level: Scan | null = first; level && level.status === 'completed'; ) {
      levels.push(level);
      level = await repo.findOne({ where: { followsScanId: level.id, status: 'completed' }, order: { id: 'ASC' } });
    }
    if (levels.length === 0) return null;
    const refinement = first.spec.refinement;
    const lattice = new RefinementLattice(parent.spec.axes, refinement.factors, refinement.depth);
    const mesh = new RefinementMesh(lattice, levels.map((level) => level.spec.refinement!.cells));
    return { parent, levels, mesh, refinement };
  }

  /** Each node's value by finest key, read from the parent and the levels' OK points (null stays absent). */
  async nodeValues(
    chain: Pick<MergedChain, 'parent' | 'levels' | 'mesh'>,
    value: PointValue,
    column = 'NULL',
    origins?: Map<string, { scanId: number; pointIndex: number }>,
  ): Promise<Map<string, number | null>> {
    const out = new Map<string, number | null>();
    await this.forEachNode<Parameters<PointValue>[0]>(chain, `ns, r, alpha_s, ${column} AS value`, "status = 'ok'", (key, row, scanId) => {
      out.set(key, value(row));
      origins?.set(key, { scanId, pointIndex: Number(row.point_index) });
    });
    return out;
  }

  /** Each failed node's reason by finest key. */
  private async nodeFailures(chain: Pick<MergedChain, 'parent' | 'levels' | 'mesh'>): Promise<Map<string, string>> {
    const out = new Map<string, string>();
    await this.forEachNode<{ status: string }>(chain, 'status', "status <> 'ok'", (key, row) => out.set(key, row.status));
    return out;
  }

  /** Visits the chain's stored points matching `where` (parent's, then each level's) at their keys on the finest lattice. */
  private async forEachNode<Row>(
    chain: Pick<MergedChain, 'parent' | 'levels' | 'mesh'>,
    select: string,
    where: string,
    visit: (key: string, row: Row & { point_index: number }, scanId: number) => void,
  ): Promise<void> {
    const { lattice } = chain.mesh;
    const grid = new ScanGrid(chain.parent.spec.axes!);
    const read = async (scanId: number, place: (index: number) => number[] | undefined) => {
      const rows: (Row & { point_index: number })[] = await this.db.query(`SELECT point_index, ${select} FROM scan_points WHERE scan_id = ? AND ${where}`, [scanId]);
      for (const row of rows) {
        const finest = place(Number(row.point_index));
        if (finest) visit(nodeKey(finest), row, scanId);
      }
    };
    await read(chain.parent.id, (i) => (i < grid.size ? lattice.toFinest(0, grid.indices(i)) : undefined));
    for (const level of chain.levels) {
      const block = level.spec.refinement!;
      await read(level.id, (i) => (block.lattice[i] ? lattice.toFinest(block.level, block.lattice[i]) : undefined));
    }
  }

  /**
   * A heatmap slice of a refined two-axis grid (or of a level) gains its chain's refined cells in
   * the window, with the output's values at their corners and their failures (Δχ² under the asked
   * set for a Δχ² slice, nothing but failures for the status panel); any other slice comes back as it was.
   */
  async withRefinedCells(user: SessionUser, id: number, q: ScanGridQuery, slice: ScanGridSlice): Promise<ScanGridSlice> {
    const chain = await this.mergedChain(await this.results.readable(user, id));
    const axes = chain?.parent.spec.axes;
    if (!chain || axes?.length !== 2) return slice;
    const swapped = slice.x.parameter === axes[1].parameter;
    const { value, column } = await this.sliceValue(q);
    const values = await this.nodeValues(chain, value, column);
    const [first, second] = swapped ? [slice.y, slice.x] : [slice.x, slice.y];
    const cells = refinedCells(chain.mesh, values, { xFrom: first.from, xTo: first.to, yFrom: second.from, yTo: second.to }, await this.nodeFailures(chain));
    const scale = chain.mesh.lattice.axes.map((axis) => axis.factor ** chain.mesh.lattice.depth);
    // Corners run x lower/upper fastest: with the axes swapped, the second and third change places.
    const inSliceOrder = ([c00, c10, c01, c11]: RefinedCell['corners']): RefinedCell['corners'] => (swapped ? [c00, c01, c10, c11] : [c00, c10, c01, c11]);
    return {
      ...slice,
      refined: {
        scale: swapped ? [scale[1], scale[0]] : [scale[0], scale[1]],
        cells: cells.map((cell) => ({
          level: cell.level,
          x: swapped ? cell.y : cell.x,
          y: swapped ? cell.x : cell.y,
          corners: inSliceOrder(cell.corners).map((v) => (v === null ? null : roundForSlice(v))) as RefinedCell['corners'],
          failure: cell.failure,
        })),
      },
    };
  }

  /** What a slice's refined cells carry at their corners: the output, Δχ² under the asked set, or (status) nothing. */
  private async sliceValue(q: ScanGridQuery): Promise<{ value: PointValue; column: string }> {
    if (q.output === 'status') return { value: () => null, column: 'NULL' };
    if (q.output !== 'deltaChi2') return this.pointValue({ output: q.output });
    if (q.likelihood?.kind !== 'set') throw new Error('a Δχ² slice names a likelihood set (the query schema asks for one)');
    return this.pointValue({ set: q.likelihood });
  }

  /**
   * Every point of a refined grid and its chain's completed levels as one table, a page at a time,
   * sorted and filtered as a scan's `/points` (one query over the chain's scans, the parent's axes
   * naming the inputs); by default the parent's first, then each level's, each by point index. Each
   * row names its scan and level. 409 for a scan without refinement (its own `/points` is the table).
   */
  async points(user: SessionUser, id: number, q: ScanPointsQuery): Promise<RefinedPointPage> {
    // The merged table has no download: each level's own `/points` exports its points.
    if (q.format) throw badRequest({ format: `the points of every level come as pages only: download each scan's own at /api/scans/<id>/points?format=${q.format}` });
    const chain = await this.mergedChain(await this.results.readable(user, id));
    if (!chain) throw new ConflictException(`Scan ${id} has no completed refinement level: its own points are at /api/scans/${id}/points`);
    const scans = [chain.parent, ...chain.levels];
    const level = new Map(scans.map((scan) => [scan.id, scan.refinementLevel ?? 0]));
    const { rows, total, likelihood } = await this.results.pageOfScans(user, chain.parent, scans.map((scan) => scan.id), q);
    return {
      items: rows.map((row) => ({ ...toDto(row, likelihood), scanId: Number(row.scan_id), level: level.get(Number(row.scan_id)) ?? 0 })),
      total,
      page: q.page,
      pageSize: q.pageSize,
      ...(likelihood && { judgedBy: likelihood.description.ref }),
      parentScanId: chain.parent.id,
      levelScanIds: chain.levels.map((scan) => scan.id),
    };
  }

  private async boundaryValue(boundary: RefinementBoundary): Promise<{ value: PointValue; column: string }> {
    if (boundary.kind === 'output') return this.pointValue({ output: boundary.output });
    const ref = likelihoodRefSchema.parse(boundary.likelihood);
    if (ref.kind !== 'set') throw new Error('a refinement boundary names a likelihood set');
    return this.pointValue({ set: ref });
  }

  /** How a node's value is read from its row: a stored output's column, or Δχ² under a likelihood set. */
  private async pointValue(of: { output: PointOutput } | { set: { key: string; version: number | undefined } }): Promise<{ value: PointValue; column: string }> {
    if ('output' in of) return { value: (row) => (row.value === null ? null : Number(row.value)), column: OUTPUT_COLUMN[of.output] };
    const judge = judgeBySet(await this.sets.find(of.set.key, of.set.version));
    return { value: (row) => judge({ ns: row.ns, r: row.r, alphaS: row.alpha_s })?.deltaChi2 ?? null, column: 'NULL' };
  }

  /** Checks a request against its parent and works out level 1 (refusing what cannot be refined, with the field). */
  private async plan(parent: Scan, q: RefineScan): Promise<{ lattice: RefinementLattice; boundary: RefinementBoundary; next: NextLevel }> {
    if (parent.refinementLevel !== null) throw new ConflictException(`Scan ${parent.id} is level ${parent.refinementLevel} of a refinement of scan ${parent.refinesScanId}: refine the grid scan itself`);
    if (!parent.spec.axes) throw new ConflictException(`Scan ${parent.id} runs over a list of points: only a grid scan has cells to refine`);
    if (parent.status !== 'completed') throw new ConflictException(`Scan ${parent.id} is ${parent.status}: only a completed scan can be refined`);
    const names = parent.spec.axes.map((axis) => axis.parameter);
    const unknown = Object.keys(q.factors).filter((name) => !names.includes(name));
    if (unknown.length) throw badRequest(Object.fromEntries(unknown.map((name) => [`factors.${name}`, `the scan has no axis ${name}; its axes are ${names.join(', ')}`])));
    let lattice: RefinementLattice;
    try {
      lattice = new RefinementLattice(parent.spec.axes, names.map((name) => q.factors[name] ?? 2), q.depth);
    } catch (error) {
      if (!(error instanceof RangeError)) throw error;
      throw badRequest({ factors: error.message });
    }
    let boundary = q.boundary;
    if (boundary.kind === 'likelihood') {
      const ref = likelihoodRefSchema.safeParse(boundary.likelihood);
      if (!ref.success) throw badRequest({ 'boundary.likelihood': ref.error.issues[0].message });
      if (ref.data.kind !== 'set') throw badRequest({ 'boundary.likelihood': 'a refinement boundary needs a likelihood set (key or key@version): later levels are judged without a request' });
      // Pinned to a version, so every level of the chain is judged alike.
      const set = await this.sets.find(ref.data.key, ref.data.version);
      boundary = { ...boundary, likelihood: `${set.key}@${set.version}` };
    }
    const mesh = new RefinementMesh(lattice, []);
    const next = await this.nextLevel({ parent, levels: [], mesh }, boundary);
    if (next.cells.length === 0) throw new ConflictException(`The boundary crosses no cell of scan ${parent.id}: nothing to refine`);
    if (next.nodes.length > POINT_LIST_MAX_POINTS) throw badRequest({ factors: `the first level would have ${next.nodes.length} points, more than ${POINT_LIST_MAX_POINTS} a level may have: use smaller factors` });
    return { lattice, boundary, next };
  }

  private async nextLevel(chain: Pick<MergedChain, 'parent' | 'levels' | 'mesh'>, boundary: RefinementBoundary): Promise<NextLevel> {
    const { value, column } = await this.boundaryValue(boundary);
    const values = await this.nodeValues(chain, value, column);
    return chain.mesh.nextLevel((key) => boundaryDistance(boundary, values.get(key)));
  }

  /** Follows one finished level; true when it created the next. */
  private async follow(id: number): Promise<boolean> {
    const level = await this.db.getRepository(Scan).findOneBy({ id });
    const block = level?.spec.refinement;
    if (!level || !block || level.status !== 'completed' || block.level >= block.depth) return false;
    const chain = await this.mergedChain(level);
    // Only a chain complete up to this level goes on. A level is followed once: retrying its failed points later does not follow it again.
    if (!chain || chain.levels[chain.levels.length - 1].id !== level.id) return false;
    const next = await this.nextLevel(chain, block.boundary);
    if (next.cells.length === 0) {
      this.logger.log(`refinement of scan ${block.parentScanId} ends at level ${block.level}: no cell is crossed`);
      return false;
    }
    if (next.nodes.length > POINT_LIST_MAX_POINTS) {
      this.logger.warn(`refinement of scan ${block.parentScanId} ends at level ${block.level}: level ${next.level} would have ${next.nodes.length} points, more than ${POINT_LIST_MAX_POINTS}`);
      return false;
    }
    const nextBlock: ScanRefinement = { ...block, level: next.level, cells: next.cells, lattice: next.nodes };
    await this.scans.submit(level.ownerId, this.levelSpec(chain.parent, nextBlock, chain.mesh.lattice), { block: nextBlock, followsScanId: level.id });
    return true;
  }

  /** A level's scan: the parent's model, method, fixed parameters and pivot, over its new nodes as a point list. */
  private levelSpec(parent: Scan, block: ScanRefinement, lattice: RefinementLattice): CreateScan {
    const spec = parent.spec;
    const boundary = block.boundary.kind === 'likelihood' ? `${block.boundary.level} % of ${block.boundary.likelihood}` : `${block.boundary.output} = ${block.boundary.value}`;
    const name = `${parent.name} — refined at ${boundary}, level ${block.level} of ${block.depth}`.slice(0, 200);
    return createScanSchema.parse({
      groupId: parent.groupId,
      name,
      tags: [],
      note: '',
      model: spec.model,
      params: spec.params,
      phiInit: spec.phiInit,
      pointList: { columns: lattice.axes.map((axis) => axis.axis.parameter), rows: block.lattice.map((node) => lattice.values(block.level, node)) },
      pivot: spec.pivot,
      method: spec.method,
      tolerance: spec.tolerance,
    });
  }
}

function badRequest(fields: Record<string, string>): BadRequestException {
  return new BadRequestException({
    message: Object.entries(fields).map(([field, message]) => `${field}: ${message}`).join('. '),
    fieldErrors: Object.fromEntries(Object.entries(fields).map(([field, message]) => [field, [message]])),
  });
}
