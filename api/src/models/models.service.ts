import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { In, QueryFailedError, type DataSource, type Repository } from 'typeorm';
import {
  modelInputSchema, readModelFile, toModelFile, type ModelFile, type ModelInput, type ModelUpdate, type PotentialModel as PotentialModelDto,
} from '@sixtyfold/shared';
import { AuditService } from '../audit/audit.service';
import { zodBadRequest } from '../common/pipes/zod-validation.pipe';
import { uploadBadRequest } from '../common/uploads/read-csv-upload';
import type { SessionUser } from '../common/session-user';
import { Group } from '../groups/entities/group.entity';
import { GroupAccessService } from '../groups/group-access.service';
import { Scan } from '../scans/entities/scan.entity';
import { PotentialModel } from './entities/potential-model.entity';

/** The unique index on (group_id, name): one name per model within a group. */
const NAME_INDEX = 'uq_potential_models_group_name';

@Injectable()
export class ModelsService {
  constructor(
    @InjectRepository(PotentialModel) private readonly models: Repository<PotentialModel>,
    @InjectDataSource() private readonly db: DataSource,
    private readonly access: GroupAccessService,
    private readonly audit: AuditService,
  ) {}

  async list(user: SessionUser): Promise<PotentialModelDto[]> {
    const ids = await this.access.readableGroupIds(user);
    if (ids && ids.length === 0) return [];
    const rows = await this.models.find({ where: ids ? { groupId: In(ids) } : {}, order: { name: 'ASC' } });
    return rows.map(toDto);
  }

  async get(user: SessionUser, id: number): Promise<PotentialModelDto> {
    return toDto(await this.load(user, id, 'viewer'));
  }

  /** Members and leads add models to their group; the name must be new there. */
  async create(user: SessionUser, input: ModelInput): Promise<PotentialModelDto> {
    await this.access.require(user, input.groupId, 'member');
    // Site admins pass the role check for any id, so the group itself must exist.
    if (!(await this.db.getRepository(Group).existsBy({ id: input.groupId }))) throw new NotFoundException('No such group');
    const id = await this.uniqueName(input.groupId, input.name, () =>
      this.db.transaction(async (tx) => {
        const saved = await tx.getRepository(PotentialModel).save({
          groupId: input.groupId,
          name: input.name,
          expression: input.expression,
          parameters: input.parameters,
          phiInit: input.phiInit,
          description: input.description,
          createdById: user.id,
        });
        await this.audit.record(
          { action: 'model.create', actorId: user.id, groupId: input.groupId, targetType: 'model', targetId: saved.id, details: { name: input.name } },
          tx,
        );
        return saved.id;
      }),
    );
    return toDto(await this.models.findOneByOrFail({ id }));
  }

  /**
   * A model file becomes a model of the group by the same rules (and the same one transaction) as
   * one typed in; the whole file is read and checked first, and a refusal names its line.
   */
  async importFile(user: SessionUser, groupId: number, file: Express.Multer.File | undefined): Promise<PotentialModelDto> {
    if (!file) throw new BadRequestException('Attach the model file as the multipart field "file"');
    await this.access.require(user, groupId, 'member');
    let text: string;
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(file.buffer);
    } catch {
      throw uploadBadRequest({ message: 'the file is not UTF-8 text' });
    }
    const read = readModelFile(text.replace(/^\uFEFF/, ''), groupId);
    if (!read.ok) throw uploadBadRequest(read);
    return this.create(user, read.model);
  }

  async exportFile(user: SessionUser, id: number): Promise<{ file: ModelFile; fileName: string }> {
    const model = await this.load(user, id, 'viewer');
    const slug = model.name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '') || `model-${id}`;
    return { file: toModelFile(model), fileName: `${slug}.potential.json` };
  }

  /**
   * Replaces the fields given. The model that results (stored fields with these replaced) is
   * checked by the same rules as a new one, so an expression keeps matching its parameters.
   */
  async update(user: SessionUser, id: number, changes: ModelUpdate): Promise<PotentialModelDto> {
    const model = await this.load(user, id, 'member');
    const merged = modelInputSchema.safeParse({
      groupId: model.groupId,
      name: changes.name ?? model.name,
      expression: changes.expression ?? model.expression,
      parameters: changes.parameters ?? model.parameters,
      phiInit: changes.phiInit ?? model.phiInit,
      description: changes.description ?? model.description,
    });
    if (!merged.success) throw zodBadRequest(merged.error);
    const next = merged.data;
    const changed = (['name', 'expression', 'parameters', 'phiInit', 'description'] as const).filter(
      (field) => JSON.stringify(next[field]) !== JSON.stringify(model[field]),
    );
    if (changed.length > 0) {
      await this.uniqueName(model.groupId, next.name, () =>
        this.db.transaction(async (tx) => {
          await tx.getRepository(PotentialModel).update(
            { id },
            { name: next.name, expression: next.expression, parameters: next.parameters, phiInit: next.phiInit, description: next.description },
          );
          await this.audit.record(
            { action: 'model.update', actorId: user.id, groupId: model.groupId, targetType: 'model', targetId: id, details: { name: next.name, changed } },
            tx,
          );
        }),
      );
    }
    return toDto(await this.models.findOneByOrFail({ id }));
  }

  /**
   * Leads (and site admins) delete a model. Its scans keep working: a scan freezes the model's
   * expression, parameter values and φ_init into its stored spec at submission (completeSpec in
   * scans/scan-submission.ts), and the workers read only that spec. Their model_id becomes NULL.
   */
  async remove(user: SessionUser, id: number): Promise<void> {
    const model = await this.load(user, id, 'lead');
    await this.db.transaction(async (tx) => {
      const scans = await tx.getRepository(Scan).countBy({ modelId: id });
      await this.audit.record(
        { action: 'model.delete', actorId: user.id, groupId: model.groupId, targetType: 'model', targetId: id, details: { name: model.name, expression: model.expression, scans } },
        tx,
      );
      await tx.getRepository(PotentialModel).delete({ id });
    });
  }

  private async load(user: SessionUser, id: number, minRole: 'viewer' | 'member' | 'lead'): Promise<PotentialModel> {
    const model = await this.models.findOne({ where: { id } });
    if (!model) throw new NotFoundException('No such model');
    await this.access.require(user, model.groupId, minRole, 'model');
    return model;
  }

  /** Runs a write, turning a clash on the group's model names into a 409 that says which name. */
  private async uniqueName<T>(groupId: number, name: string, write: () => Promise<T>): Promise<T> {
    try {
      return await write();
    } catch (error) {
      const driver = error instanceof QueryFailedError ? (error.driverError as { code?: string; sqlMessage?: string }) : undefined;
      if (driver?.code === 'ER_DUP_ENTRY' && driver.sqlMessage?.includes(NAME_INDEX)) {
        const group = await this.db.getRepository(Group).findOneBy({ id: groupId });
        throw new ConflictException(`${group?.name ?? 'The group'} already has a model named "${name}"; choose another name`);
      }
      throw error;
    }
  }
}

function toDto(m: PotentialModel): PotentialModelDto {
  return {
    id: m.id,
    groupId: m.groupId,
    name: m.name,
    expression: m.expression,
    parameters: m.parameters,
    phiInit: m.phiInit,
    description: m.description,
    createdById: m.createdById,
    createdAt: m.createdAt.toISOString(),
    updatedAt: m.updatedAt.toISOString(),
  };
}
