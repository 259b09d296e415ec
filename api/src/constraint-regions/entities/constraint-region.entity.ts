import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { RegionVertex } from '@sixtyfold/shared';
import { Group } from '../../groups/entities/group.entity';
import { User } from '../../users/entities/user.entity';

/** An observational constraint a group uploaded: a closed outline in the n_s–r plane. */
@Entity('constraint_regions')
@Index('ix_constraint_regions_group', ['groupId'])
export class ConstraintRegion {
  @PrimaryGeneratedColumn({ unsigned: true })
  id: number;

  @Column({ name: 'group_id', type: 'int', unsigned: true })
  groupId: number;

  @Column({ type: 'varchar', length: 120 })
  name: string;

  @Column({ type: 'varchar', length: 500 })
  source: string;

  /** Strictly between 0 and 1, e.g. 0.95. */
  @Column({ name: 'confidence_level', type: 'double' })
  confidenceLevel: number;

  /** The boundary in order; drawing closes it. */
  @Column({ type: 'json' })
  vertices: RegionVertex[];

  @Column({ name: 'created_by_id', type: 'int', unsigned: true, nullable: true })
  createdById: number | null;

  @CreateDateColumn({ name: 'created_at', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;

  @ManyToOne(() => Group, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'group_id' })
  group: Group;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'created_by_id' })
  createdBy: User | null;
}
