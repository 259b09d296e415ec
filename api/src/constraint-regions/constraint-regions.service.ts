import { ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { In, type DataSource, type Repository } from 'typeorm';
import { groupRoleAtLeast, regionCsvReader, type ConstraintRegion as ConstraintRegionDto, type ConstraintRegionUpload } from '@sixtyfold/shared';
import { AuditService } from '../audit/audit.service';
import type { SessionUser } from '../common/session-user';
import { readCsvUpload } from '../common/uploads/read-csv-upload';
import { Group } from '../groups/entities/group.entity';
import { GroupAccessService } from '../groups/group-access.service';
import { ConstraintRegion } from './entities/constraint-region.entity';

@Injectable()
export class ConstraintRegionsService {
  constructor(
    @InjectRepository(ConstraintRegion) private readonly regions: Repository<ConstraintRegion>,
    @InjectDataSource() private readonly db: DataSource,
    private readonly access: GroupAccessService,
    private readonly audit: AuditService,
  ) {}

  /** The regions of my groups (or of one of them), newest first. */
  async list(user: SessionUser, groupId?: number): Promise<ConstraintRegionDto[]> {
    if (groupId !== undefined) await this.access.require(user, groupId, 'viewer');
    const ids = groupId !== undefined ? [groupId] : await this.access.readableGroupIds(user);
    if (ids && ids.length === 0) return [];
    const rows = await this.regions.find({ where: ids ? { groupId: In(ids) } : {}, order: { createdAt: 'DESC', id: 'DESC' } });
    return rows.map(toDto);
  }

  /**
   * Regions by id, in the order asked, each readable by the user as the list is (a viewer of its
   * group). An unknown id and another group's region answer the same 404.
   */
  async readable(user: SessionUser, ids: readonly number[]): Promise<ConstraintRegionDto[]> {
    const rows = await this.regions.findBy({ id: In([...ids]) });
    const found: ConstraintRegionDto[] = [];
    for (const id of ids) {
      const region = rows.find((row) => row.id === id);
      if (!region) throw new NotFoundException(`No such constraint region ${id}`);
      await this.access.require(user, region.groupId, 'viewer', `constraint region ${id}`);
      found.push(toDto(region));
    }
    return found;
  }

  /**
   * Members store a region whose file was read in full; one insert and its audit event. The role
   * comes first, so that someone who may not upload here learns nothing from the file.
   */
  async create(user: SessionUser, fields: ConstraintRegionUpload, file: Express.Multer.File | undefined): Promise<ConstraintRegionDto> {
    await this.access.require(user, fields.groupId, 'member');
    if (!(await this.db.getRepository(Group).existsBy({ id: fields.groupId }))) throw new NotFoundException('No such group');
    const vertices = await readCsvUpload(file, 'file', regionCsvReader());
    const id = await this.db.transaction(async (tx) => {
      const saved = await tx.getRepository(ConstraintRegion).save({ ...fields, vertices, createdById: user.id });
      await this.audit.record(
        { action: 'region.create', actorId: user.id, groupId: fields.groupId, targetType: 'constraint-region', targetId: saved.id, details: { name: fields.name, vertices: vertices.length } },
        tx,
      );
      return saved.id;
    });
    return toDto(await this.regions.findOneByOrFail({ id }));
  }

  /** Leads (and site admins) delete any region of their group; members only their own. */
  async remove(user: SessionUser, id: number): Promise<void> {
    const region = await this.regions.findOneBy({ id });
    if (!region) throw new NotFoundException('No such region');
    await this.access.require(user, region.groupId, 'viewer', 'region');
    const role = await this.access.roleIn(user, region.groupId);
    const allowed = user.siteRole === 'admin' || (role !== null && (groupRoleAtLeast(role, 'lead') || (groupRoleAtLeast(role, 'member') && region.createdById === user.id)));
    if (!allowed) throw new ForbiddenException('Only a lead of the group or the member who uploaded the region can delete it');
    await this.db.transaction(async (tx) => {
      await this.audit.record(
        { action: 'region.delete', actorId: user.id, groupId: region.groupId, targetType: 'constraint-region', targetId: id, details: { name: region.name, source: region.source } },
        tx,
      );
      await tx.getRepository(ConstraintRegion).delete({ id });
    });
  }
}

function toDto(r: ConstraintRegion): ConstraintRegionDto {
  return {
    id: r.id,
    groupId: r.groupId,
    name: r.name,
    source: r.source,
    confidenceLevel: r.confidenceLevel,
    vertices: r.vertices,
    createdById: r.createdById,
    createdAt: r.createdAt.toISOString(),
  };
}
