import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { ModelParameter } from '@sixtyfold/shared';
import { Group } from '../../groups/entities/group.entity';
import { User } from '../../users/entities/user.entity';

/** A group's own potential V(phi), written as an expression in phi and named parameters. */
@Entity('potential_models')
@Index('uq_potential_models_group_name', ['groupId', 'name'], { unique: true })
export class PotentialModel {
  @PrimaryGeneratedColumn({ unsigned: true })
  id: number;

  @Column({ name: 'group_id', type: 'int', unsigned: true })
  groupId: number;

  @Column({ type: 'varchar', length: 120 })
  name: string;

  @Column({ type: 'text' })
  expression: string;

  @Column({ type: 'json' })
  parameters: ModelParameter[];

  /** Where integration starts when a scan does not say (field value, M_pl = 1). */
  @Column({ name: 'phi_init', type: 'double', nullable: true })
  phiInit: number | null;

  @Column({ type: 'varchar', length: 2000, default: '' })
  description: string;

  @Column({ name: 'created_by_id', type: 'int', unsigned: true, nullable: true })
  createdById: number | null;

  @CreateDateColumn({ name: 'created_at', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', onUpdate: 'CURRENT_TIMESTAMP(3)' })
  updatedAt: Date;

  @ManyToOne(() => Group, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'group_id' })
  group: Group;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'created_by_id' })
  createdBy: User | null;
}
