import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { LikelihoodSet } from '@sixtyfold/shared';
import { User } from '../../users/entities/user.entity';

/**
 * A likelihood set an admin added: one row per version, never edited, so results judged with a
 * version can always name it. The built-in sets live in the shared package, not here.
 */
@Entity('likelihood_sets')
@Index('uq_likelihood_sets_key_version', ['key', 'version'], { unique: true })
export class StoredLikelihoodSet {
  @PrimaryGeneratedColumn({ unsigned: true })
  id: number;

  @Column({ name: 'set_key', type: 'varchar', length: 64 })
  key: string;

  @Column({ type: 'int', unsigned: true })
  version: number;

  /** The whole set as `likelihoodSetSchema` reads it (key and version included). */
  @Column({ type: 'json' })
  definition: LikelihoodSet;

  @Column({ name: 'created_by_id', type: 'int', unsigned: true, nullable: true })
  createdById: number | null;

  @CreateDateColumn({ name: 'created_at', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'created_by_id' })
  createdBy: User | null;
}
