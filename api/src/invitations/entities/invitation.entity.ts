import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { GROUP_ROLES, type GroupRole } from '@sixtyfold/shared';
import type { Group } from '../../groups/entities/group.entity';
import type { User } from '../../users/entities/user.entity';

/**
 * An invitation to join a group by e-mail. The link's token is an HMAC over the id and expiry,
 * so nothing secret is stored here; a token is pending while accepted and revoked are empty.
 */
@Entity('invitations')
@Index('ix_invitations_group_email', ['groupId', 'email'])
export class Invitation {
  @PrimaryGeneratedColumn({ unsigned: true })
  id: number;

  @Column({ name: 'group_id', type: 'int', unsigned: true })
  groupId: number;

  @Column({ type: 'varchar', length: 254 })
  email: string;

  @Column({ type: 'enum', enum: GROUP_ROLES })
  role: GroupRole;

  @Column({ name: 'invited_by_id', type: 'int', unsigned: true, nullable: true })
  invitedById: number | null;

  @CreateDateColumn({ name: 'created_at', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;

  @Column({ name: 'expires_at', type: 'datetime', precision: 3 })
  expiresAt: Date;

  @Column({ name: 'accepted_at', type: 'datetime', precision: 3, nullable: true })
  acceptedAt: Date | null;

  @Column({ name: 'accepted_by_id', type: 'int', unsigned: true, nullable: true })
  acceptedById: number | null;

  @Column({ name: 'revoked_at', type: 'datetime', precision: 3, nullable: true })
  revokedAt: Date | null;

  @ManyToOne('Group', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'group_id' })
  group: Group;

  @ManyToOne('User', { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'invited_by_id' })
  invitedBy: User | null;

  @ManyToOne('User', { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'accepted_by_id' })
  acceptedBy: User | null;
}
