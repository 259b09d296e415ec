import { Column, CreateDateColumn, Entity, Index, OneToMany, PrimaryGeneratedColumn } from 'typeorm';
import type { Membership } from './membership.entity';

@Entity('groups')
export class Group {
  @PrimaryGeneratedColumn({ unsigned: true })
  id: number;

  @Index('uq_groups_slug', { unique: true })
  @Column({ type: 'varchar', length: 64 })
  slug: string;

  @Column({ type: 'varchar', length: 120 })
  name: string;

  @Column({ type: 'varchar', length: 1000, default: '' })
  description: string;

  /** Largest scan (in points) this group may submit. */
  @Column({ name: 'point_limit', type: 'int', unsigned: true, default: 1_000_000 })
  pointLimit: number;

  /** Retention: finished scans with `retentionStatuses` are pruned after this many days; null keeps them. */
  @Column({ name: 'retention_days', type: 'int', unsigned: true, nullable: true })
  retentionDays: number | null;

  @Column({ name: 'retention_statuses', type: 'varchar', length: 100, default: 'completed,failed,cancelled' })
  retentionStatuses: string;

  @CreateDateColumn({ name: 'created_at', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;

  @OneToMany('Membership', (m: Membership) => m.group)
  memberships: Membership[];
}
