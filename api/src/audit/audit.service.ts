import { Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import type { EntityManager, Repository } from 'typeorm';
import type { AuditAction, AuditEvent as AuditEventDto, AuditTargetType, Page } from '@sixtyfold/shared';
import { AuditEvent } from './entities/audit-event.entity';

export interface AuditRecord {
  action: AuditAction;
  actorId: number | null;
  groupId?: number | null;
  targetType?: AuditTargetType;
  targetId?: string | number;
  details?: Record<string, unknown>;
}

export interface AuditQuery {
  page: number;
  pageSize: number;
  action?: AuditAction;
  /** `none`: the events no user caused. */
  actorId?: number | 'none';
  groupId?: number;
  targetType?: AuditTargetType;
  /** ISO date or date-time, inclusive. */
  from?: string;
  /** ISO date or date-time, exclusive; a plain date includes that whole day. */
  to?: string;
}

const PLAIN_DATE = /^\d{4}-\d{2}-\d{2}$/;

@Injectable()
export class AuditService {
  constructor(@InjectRepository(AuditEvent) private readonly events: Repository<AuditEvent>) {}

  /** Appends one event; pass the transaction's manager so the event commits with the change. */
  async record(entry: AuditRecord, manager?: EntityManager): Promise<void> {
    const repo = manager ? manager.getRepository(AuditEvent) : this.events;
    await repo.insert({
      action: entry.action,
      actorId: entry.actorId,
      groupId: entry.groupId ?? null,
      targetType: entry.targetType ?? null,
      targetId: entry.targetId === undefined ? null : String(entry.targetId),
      details: (entry.details ?? {}) as AuditEvent['details'] & object,
    });
  }

  async list(query: AuditQuery): Promise<Page<AuditEventDto>> {
    const qb = this.events
      .createQueryBuilder('e')
      .leftJoinAndSelect('e.actor', 'actor')
      .orderBy('e.createdAt', 'DESC')
      .addOrderBy('e.id', 'DESC')
      .skip((query.page - 1) * query.pageSize)
      .take(query.pageSize);
    if (query.action) qb.andWhere('e.action = :action', { action: query.action });
    if (query.actorId === 'none') qb.andWhere('e.actorId IS NULL');
    else if (query.actorId) qb.andWhere('e.actorId = :actorId', { actorId: query.actorId });
    if (query.groupId) qb.andWhere('e.groupId = :groupId', { groupId: query.groupId });
    if (query.targetType) qb.andWhere('e.targetType = :targetType', { targetType: query.targetType });
    // Plain dates are UTC days, as the page shows them.
    if (query.from) qb.andWhere('e.createdAt >= :from', { from: new Date(PLAIN_DATE.test(query.from) ? `${query.from}T00:00:00Z` : query.from) });
    if (query.to) {
      const end = PLAIN_DATE.test(query.to) ? new Date(Date.parse(`${query.to}T00:00:00Z`) + 86_400_000) : new Date(query.to);
      qb.andWhere('e.createdAt < :to', { to: end });
    }
    const [rows, total] = await qb.getManyAndCount();
    return {
      items: rows.map((e) => ({
        id: e.id,
        action: e.action,
        actorId: e.actorId,
        actorEmail: e.actor?.email ?? null,
        groupId: e.groupId,
        targetType: e.targetType,
        targetId: e.targetId,
        details: e.details,
        createdAt: e.createdAt.toISOString(),
      })),
      total,
      page: query.page,
      pageSize: query.pageSize,
    };
  }
}
