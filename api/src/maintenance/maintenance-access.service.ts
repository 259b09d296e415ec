import { Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import type { Repository } from 'typeorm';
import type { SessionUser } from '../common/session-user';
import { Membership } from '../groups/entities/membership.entity';

/** Maintenance is for site admins everywhere and for leads within the groups they lead. */
@Injectable()
export class MaintenanceAccessService {
  constructor(@InjectRepository(Membership) private readonly memberships: Repository<Membership>) {}

  /** Ids of the groups the user leads; `null` means every group (site admin). */
  async ledGroupIds(user: SessionUser): Promise<number[] | null> {
    if (user.siteRole === 'admin') return null;
    const rows = await this.memberships.find({ where: { userId: user.id, role: 'lead' }, select: { groupId: true } });
    return rows.map((m) => m.groupId);
  }
}
