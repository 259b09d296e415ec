import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from '../../users/entities/user.entity';

/** Who did what, when: sign-ins, deletions, role changes. Never updated, only appended. */
@Entity('audit_events')
@Index('ix_audit_events_created', ['createdAt'])
@Index('ix_audit_events_action_created', ['action', 'createdAt'])
@Index('ix_audit_events_actor', ['actorId'])
@Index('ix_audit_events_group', ['groupId'])
export class AuditEvent {
  @PrimaryGeneratedColumn({ unsigned: true })
  id: number;

  /** Dotted verb, e.g. `auth.login`, `scan.delete`, `membership.role_change`. */
  @Column({ type: 'varchar', length: 64 })
  action: string;

  @Column({ name: 'actor_id', type: 'int', unsigned: true, nullable: true })
  actorId: number | null;

  @Column({ name: 'group_id', type: 'int', unsigned: true, nullable: true })
  groupId: number | null;

  @Column({ name: 'target_type', type: 'varchar', length: 32, nullable: true })
  targetType: string | null;

  @Column({ name: 'target_id', type: 'varchar', length: 64, nullable: true })
  targetId: string | null;

  @Column({ type: 'json' })
  details: Record<string, unknown>;

  @CreateDateColumn({ name: 'created_at', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'actor_id' })
  actor: User | null;
}
