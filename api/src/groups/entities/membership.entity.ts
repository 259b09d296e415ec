import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { GROUP_ROLES, type GroupRole } from '@sixtyfold/shared';
import type { User } from '../../users/entities/user.entity';
import type { Group } from './group.entity';

@Entity('memberships')
@Index('uq_memberships_group_user', ['groupId', 'userId'], { unique: true })
@Index('ix_memberships_user', ['userId'])
export class Membership {
  @PrimaryGeneratedColumn({ unsigned: true })
  id: number;

  @Column({ name: 'group_id', type: 'int', unsigned: true })
  groupId: number;

  @Column({ name: 'user_id', type: 'int', unsigned: true })
  userId: number;

  @Column({ type: 'enum', enum: GROUP_ROLES })
  role: GroupRole;

  @CreateDateColumn({ name: 'created_at', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;

  @ManyToOne('Group', (g: Group) => g.memberships, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'group_id' })
  group: Group;

  @ManyToOne('User', (u: User) => u.memberships, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user: User;
}
