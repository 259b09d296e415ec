import { BadRequestException, ConflictException, ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { In, type DataSource, type Repository } from 'typeorm';
import {
  createScanSchema, groupRoleAtLeast, pointCount, pointLimitProblem, pointsCsvReader, type CreateScan, type Page, type ScanDetail, type ScanListQuery, type ScanRefinement,
  type BuildInfo, type ScanSummary,
} from '@sixtyfold/shared';
import { z } from 'zod';
import { AuditService } from '../audit/audit.service';
import { zodBadRequest } from '../common/pipes/zod-validation.pipe';
import { checkTransition, scanLifecycle } from '../database/scan-lifecycle';
import type { SessionUser } from '../common/session-user';
import { readCsvUpload, uploadBadRequest } from '../common/uploads/read-csv-upload';
import type { AppConfig } from '../config/app.config';
import { Group } from '../groups/entities/group.entity';
import { GroupAccessService } from '../groups/group-access.service';
import { ScanDeletionService } from '../maintenance/scan-deletion.service';
import { PotentialModel } from '../models/entities/potential-model.entity';
import { Scan } from './entities/scan.entity';
import { ScanTag } from './entities/scan-tag.entity';
import { ScanQueueService } from './scan-queue.service';
import { chunkOfPointSql } from './chunk-of-point';
import { submissionProvenance } from './scan-provenance';
import { completeSpec, familyModel, scaleParameterOf } from './scan-submission';

@Injectable()
export class ScansService {
  constructor(
    @InjectRepository(Scan) private readonly scans: Repository<Scan>,
    @InjectDataSource() private readonly db: DataSource,
    private readonly access: GroupAccessService,
    private readonly queue: ScanQueueService,
    private readonly audit: AuditService,
    private readonly config: ConfigService,
    private readonly deletion: ScanDeletionService,
  ) {}

  /** Validates against the model and the limits, stores the scan, then queues its chunks. */
  async create(user: SessionUser, spec: CreateScan): Promise<ScanDetail> {
    await this.access.require(user, spec.groupId, 'member');
    const scanId = await this.submit(user.id, spec);
    return this.get(user, scanId);
  }

  /**
   * The submission after the role check: the model, the limits, the stored row and its audit
   * event, then the chunks on the queue. A refinement level passes its place in the chain, stored
   * in its spec and columns (its owner is the chain's: later levels are created without a request).
   */
  async submit(ownerId: number, spec: CreateScan, refinement?: { block: ScanRefinement; followsScanId: number }): Promise<number> {
    // Site admins pass the role check for any id, so the group may still not exist.
    const group = await this.db.getRepository(Group).findOneBy({ id: spec.groupId });
    if (!group) throw new NotFoundException({ message: 'groupId: no such group', fieldErrors: { groupId: ['no such group'] } });
    let model;
    if (spec.model.kind === 'family') {
      model = familyModel(spec.model.family);
      if (!model) throw new BadRequestException({ message: `model.family: no built-in family '${spec.model.family}'`, fieldErrors: { 'model.family': [`no built-in family '${spec.model.family}'`] } });
    } else {
      const row = await this.db.getRepository(PotentialModel).findOneBy({ id: spec.model.modelId });
      if (!row || row.groupId !== spec.groupId) throw new NotFoundException({ message: 'model.modelId: no such model in this group', fieldErrors: { 'model.modelId': ['no such model in this group'] } });
      model = { source: row.expression, parameters: row.parameters, phiInit: row.phiInit, isFamily: false, scaleParameter: scaleParameterOf(row.expression, row.parameters) };
    }
    const stored = { ...completeSpec(spec, model), ...(refinement ? { refinement: refinement.block } : {}) };
    const total = pointCount(spec);
    const site = this.config.getOrThrow<AppConfig>('app').sitePointLimit;
    const tooLarge = pointLimitProblem(total, group.pointLimit, `${group.name}'s`) ?? pointLimitProblem(total, site, "the site's");
    if (tooLarge) throw new BadRequestException({ message: tooLarge, fieldErrors: { [spec.pointList ? 'pointList' : 'axes']: [tooLarge] } });

    const scanId = await this.db.transaction(async (tx) => {
      const saved = await scanLifecycle.create(tx, {
        groupId: spec.groupId,
        ownerId,
        modelId: spec.model.kind === 'group' ? spec.model.modelId : null,
        family: spec.model.kind === 'family' ? spec.model.family : null,
        name: spec.name,
        method: spec.method,
        spec: stored,
        provenance: submissionProvenance(this.config.getOrThrow<BuildInfo>('build'), stored),
        note: spec.note,
        totalPoints: total,
        queuedAt: new Date(),
        ...(refinement ? { refinesScanId: refinement.block.parentScanId, followsScanId: refinement.followsScanId, refinementLevel: refinement.block.level } : {}),
      }, 'submit', 'member');
      const tags = [...new Set(spec.tags)];
      if (tags.length) await tx.getRepository(ScanTag).insert(tags.map((tag) => ({ scanId: saved.id, tag })));
      const details = refinement ? { points: total, refines: refinement.block.parentScanId, level: refinement.block.level } : { points: total };
      await this.audit.record({ action: 'scan.create', actorId: ownerId, groupId: spec.groupId, targetType: 'scan', targetId: saved.id, details }, tx);
      return saved.id;
    });
    // Queued after the commit: a worker must find the row. If Redis fails here the scan stays
    // queued in MariaDB and start-up reconciliation enqueues it.
    await this.queue.enqueue(scanId, total, spec.method);
    return scanId;
  }

  /**
   * A scan whose points come from a CSV file (`points`): the settings arrive as JSON text, the
   * file is read and checked whole, then the scan is submitted as any other. Problems with the
   * columns, found by the schema or against the model, are reported on the file's header line.
   */
  async createFromUpload(user: SessionUser, specText: string, file: Express.Multer.File | undefined): Promise<ScanDetail> {
    let fields: unknown;
    try {
      fields = JSON.parse(specText);
    } catch {
      throw new BadRequestException({ message: 'spec: the scan settings are not valid JSON', fieldErrors: { spec: ['the scan settings are not valid JSON'] } });
    }
    if (typeof fields !== 'object' || fields === null || Array.isArray(fields) || 'axes' in fields || 'pointList' in fields) {
      const why = 'the scan settings must be one JSON object without axes or pointList: the file gives the points';
      throw new BadRequestException({ message: `spec: ${why}`, fieldErrors: { spec: [why] } });
    }
    // The role first, so that someone who may not submit here learns nothing from the file.
    const group = z.object({ groupId: z.number().int().positive() }).safeParse(fields);
    if (group.success) await this.access.require(user, group.data.groupId, 'member');
    const { pointList, headerLine } = await readCsvUpload(file, 'points', pointsCsvReader());
    const spec = createScanSchema.safeParse({ ...fields, pointList });
    try {
      if (!spec.success) throw zodBadRequest(spec.error);
      return await this.create(user, spec.data);
    } catch (error) {
      const fieldErrors = error instanceof BadRequestException ? (error.getResponse() as { fieldErrors?: Record<string, string[]> }).fieldErrors : undefined;
      const columns = Object.entries(fieldErrors ?? {}).filter(([field]) => field.startsWith('pointList.columns'));
      if (columns.length === 0) throw error;
      throw uploadBadRequest({ message: `line ${headerLine}: ${columns.flatMap(([, messages]) => messages).join('; ')}`, line: headerLine });
    }
  }

  async list(user: SessionUser, query: ScanListQuery): Promise<Page<ScanSummary>> {
    const ids = await this.access.readableGroupIds(user);
    if (ids && ids.length === 0) return { items: [], total: 0, page: query.page, pageSize: query.pageSize };
    // One page of ids first (plain columns, so the ordering and paging happen in MariaDB),
    // then those scans with their owner and tags.
    const qb = this.scans.createQueryBuilder('s').select('s.id', 'id');
    if (ids) qb.andWhere('s.groupId IN (:...ids)', { ids });
    if (query.status) qb.andWhere('s.status = :status', { status: query.status });
    if (query.groupId) qb.andWhere('s.groupId = :groupId', { groupId: query.groupId });
    if (query.ownerId) qb.andWhere('s.ownerId = :ownerId', { ownerId: query.ownerId });
    if (query.family) qb.andWhere('s.family = :family', { family: query.family });
    if (query.modelId) qb.andWhere('s.modelId = :modelId', { modelId: query.modelId });
    if (query.tag) qb.andWhere('s.id IN (SELECT t.scan_id FROM scan_tags t WHERE t.tag = :tag)', { tag: query.tag });
    if (query.createdAfter) qb.andWhere('s.createdAt >= :after', { after: new Date(query.createdAfter) });
    if (query.createdBefore) qb.andWhere('s.createdAt < :before', { before: new Date(query.createdBefore) });
    const total = await qb.clone().getCount();
    const page = await qb
      // Running and queued first, then the newest.
      .orderBy("CASE s.status WHEN 'running' THEN 0 WHEN 'queued' THEN 1 ELSE 2 END", 'ASC')
      .addOrderBy('s.created_at', 'DESC')
      .addOrderBy('s.id', 'DESC')
      .offset((query.page - 1) * query.pageSize)
      .limit(query.pageSize)
      .getRawMany<{ id: number }>();
    const pageIds = page.map((r) => Number(r.id));
    const rows = pageIds.length ? await this.scans.find({ where: { id: In(pageIds) }, relations: { owner: true, tags: true } }) : [];
    const byId = new Map(rows.map((r) => [r.id, r]));
    const items = pageIds.flatMap((id) => (byId.has(id) ? [toSummary(byId.get(id)!)] : []));
    return { items, total, page: query.page, pageSize: query.pageSize };
  }

  async get(user: SessionUser, id: number): Promise<ScanDetail> {
    const scan = await this.load(user, id);
    const running = scan.status === 'running' || scan.status === 'queued' ? await this.queue.runningPoints(id, scan.totalPoints, scan.method) : 0;
    const finished = scan.donePoints + scan.failedPoints;
    const pending = Math.max(0, scan.totalPoints - finished);
    const end = scan.finishedAt ?? new Date();
    const elapsed = scan.startedAt ? (end.getTime() - scan.startedAt.getTime()) / 1000 : null;
    const rate = elapsed && finished > 0 ? finished / elapsed : null;
    return {
      ...toSummary(scan),
      note: scan.note,
      spec: scan.spec,
      startedAt: scan.startedAt?.toISOString() ?? null,
      progress: {
        total: scan.totalPoints,
        done: scan.donePoints,
        failed: scan.failedPoints,
        running: Math.min(running, pending),
        queued: scan.status === 'cancelled' ? 0 : Math.max(0, pending - running),
        elapsedSeconds: elapsed,
        remainingSeconds: rate && pending > 0 ? pending / rate : pending === 0 ? 0 : null,
      },
    };
  }

  /** Members cancel their own scans, leads (and admins) any scan of the group. */
  async cancel(user: SessionUser, id: number): Promise<ScanDetail> {
    const scan = await this.load(user, id);
    await this.requireOwnerOrLead(user, scan, 'cancel');
    await scanLifecycle.cancel(this.db, id, scan.status, 'owner or lead');
    await this.queue.remove(id);
    await this.audit.record({ action: 'scan.cancel', actorId: user.id, groupId: scan.groupId, targetType: 'scan', targetId: id });
    return this.get(user, id);
  }

  /** Computes the failed points again (after a fix, or with other settings): their chunks go back on the queue. */
  async retryFailed(user: SessionUser, id: number): Promise<ScanDetail> {
    const scan = await this.load(user, id);
    await this.requireOwnerOrLead(user, scan, 'retry');
    checkTransition('reopen', scan.status, 'owner or lead');
    const chunkOfPoint = chunkOfPointSql(scan.spec, scan.totalPoints, scan.method);
    // The failed rows are deleted, so the points are missing again: the scan completes exactly
    // when the last of them is stored anew, and reconciliation re-queues them if jobs vanish.
    const chunks = await this.db.transaction(async (tx) => {
      await tx.query('SELECT id FROM scans WHERE id = ? FOR UPDATE', [id]);
      const rows: { chunk: string }[] = await tx.query(
        `SELECT DISTINCT ${chunkOfPoint} AS chunk FROM scan_points WHERE scan_id = ? AND status <> 'ok'`,
        [id],
      );
      if (rows.length === 0) return [];
      const removed: { affectedRows: number } = await tx.query("DELETE FROM scan_points WHERE scan_id = ? AND status <> 'ok'", [id]);
      await scanLifecycle.reopen(tx, id, scan.status, 'owner or lead', removed.affectedRows);
      return rows.map((r) => Number(r.chunk));
    });
    if (chunks.length === 0) throw new ConflictException('The scan has no failed points');
    await this.queue.enqueue(id, scan.totalPoints, scan.method, new Set(chunks));
    await this.audit.record({ action: 'scan.retry', actorId: user.id, groupId: scan.groupId, targetType: 'scan', targetId: id, details: { chunks: chunks.length } });
    return this.get(user, id);
  }

  /** A new draft with the same specification, owned by the caller, for the form to start from. */
  async clone(user: SessionUser, id: number): Promise<ScanDetail> {
    const scan = await this.load(user, id);
    await this.access.require(user, scan.groupId, 'member', 'scan');
    const copy = await this.db.transaction(async (tx) => {
      const saved = await scanLifecycle.create(tx, {
        groupId: scan.groupId, ownerId: user.id, modelId: scan.modelId, family: scan.family,
        name: `Copy of ${scan.name}`.slice(0, 200), method: scan.method, spec: scan.spec,
        note: scan.note, totalPoints: scan.totalPoints,
      }, 'draft', 'member');
      const tags = (scan.tags ?? []).map((t) => ({ scanId: saved.id, tag: t.tag }));
      if (tags.length) await tx.getRepository(ScanTag).insert(tags);
      return saved;
    });
    return this.get(user, copy.id);
  }

  /** Leads and admins only; the scan is archived first, the points go with it, and the deletion is on record. */
  async remove(user: SessionUser, id: number): Promise<void> {
    const scan = await this.load(user, id);
    await this.access.require(user, scan.groupId, 'lead', 'scan');
    await this.deletion.delete(id, user.id, 'manual', false);
    await this.queue.remove(id);
  }

  private async load(user: SessionUser, id: number): Promise<Scan> {
    // find, not findOne: with the tags joined, findOne's LIMIT 1 costs TypeORM an extra DISTINCT query per read.
    const [scan] = await this.scans.find({ where: { id }, relations: { owner: true, tags: true } });
    if (!scan) throw new NotFoundException('No such scan');
    await this.access.require(user, scan.groupId, 'viewer', 'scan');
    return scan;
  }

  private async requireOwnerOrLead(user: SessionUser, scan: Scan, verb: string): Promise<void> {
    if (user.siteRole === 'admin') return;
    const role = await this.access.roleIn(user, scan.groupId);
    if (role && groupRoleAtLeast(role, 'lead')) return;
    if (role === 'member' && scan.ownerId === user.id) return;
    throw new ForbiddenException(`Only the scan's owner or a lead of the group can ${verb} it`);
  }
}

function toSummary(s: Scan): ScanSummary {
  return {
    id: s.id,
    groupId: s.groupId,
    ownerId: s.ownerId,
    ownerName: s.owner.displayName,
    name: s.name,
    method: s.method,
    status: s.status,
    tags: (s.tags ?? []).map((t) => t.tag).sort(),
    totalPoints: s.totalPoints,
    donePoints: s.donePoints,
    failedPoints: s.failedPoints,
    createdAt: s.createdAt.toISOString(),
    finishedAt: s.finishedAt?.toISOString() ?? null,
  };
}
