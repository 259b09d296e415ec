import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { In, type Repository } from 'typeorm';
import type { PotentialModel as PotentialModelDto } from '@sixtyfold/shared';
import type { SessionUser } from '../common/session-user';
import { GroupAccessService } from '../groups/group-access.service';
import { PotentialModel } from './entities/potential-model.entity';

@Injectable()
export class ModelsService {
  constructor(
    @InjectRepository(PotentialModel) private readonly models: Repository<PotentialModel>,
    private readonly access: GroupAccessService,
  ) {}

  async list(user: SessionUser): Promise<PotentialModelDto[]> {
    const ids = await this.access.readableGroupIds(user);
    if (ids && ids.length === 0) return [];
    const rows = await this.models.find({ where: ids ? { groupId: In(ids) } : {}, order: { name: 'ASC' } });
    return rows.map(toDto);
  }

  async get(user: SessionUser, id: number): Promise<PotentialModelDto> {
    const model = await this.models.findOne({ where: { id } });
    if (!model) throw new NotFoundException('No such model');
    await this.access.require(user, model.groupId, 'viewer', 'model');
    return toDto(model);
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
