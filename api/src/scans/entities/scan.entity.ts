import {
  Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, OneToMany, PrimaryGeneratedColumn, UpdateDateColumn, type ValueTransformer,
} from 'typeorm';
import { SCAN_METHODS, SCAN_STATUSES, scanProvenanceSchema, storedScanSpecSchema, type ScanMethod, type ScanProvenance, type ScanStatus, type StoredScanSpec } from '@sixtyfold/shared';
import { Group } from '../../groups/entities/group.entity';
import { PotentialModel } from '../../models/entities/potential-model.entity';
import { User } from '../../users/entities/user.entity';
import type { ScanTag } from './scan-tag.entity';

/** Every read of `scans.spec` goes through the one schema that wrote it; a row that does not read is an error, never a cast. */
const STORED_SPEC: ValueTransformer = {
  to: (spec: StoredScanSpec | undefined) => spec,
  from: (value: unknown) => {
    if (value === null || value === undefined) return value;
    const parsed = storedScanSpecSchema.safeParse(value);
    if (!parsed.success) throw new Error(`scans.spec does not read as a stored scan spec: ${parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}`);
    return parsed.data;
  },
};

/** `scans.provenance` reads through its schema too; NULL (a scan stored before it was recorded) stays null. */
const PROVENANCE: ValueTransformer = {
  to: (value: ScanProvenance | null | undefined) => value,
  from: (value: unknown) => (value === null || value === undefined ? null : scanProvenanceSchema.parse(typeof value === 'string' ? JSON.parse(value) : value)),
};

/**
 * One submitted grid. MariaDB is the record: the counters and status here, with the
 * scan_points rows, are what progress and reconciliation read; Redis only carries the work.
 */
@Entity('scans')
@Index('ix_scans_group_status', ['groupId', 'status'])
@Index('ix_scans_group_created', ['groupId', 'createdAt'])
@Index('ix_scans_owner', ['ownerId'])
@Index('ix_scans_status', ['status'])
@Index('ix_scans_refines', ['refinesScanId'])
@Index('ix_scans_follows', ['followsScanId'])
export class Scan {
  @PrimaryGeneratedColumn({ unsigned: true })
  id: number;

  @Column({ name: 'group_id', type: 'int', unsigned: true })
  groupId: number;

  @Column({ name: 'owner_id', type: 'int', unsigned: true })
  ownerId: number;

  /** A group's own model; null when `family` names a built-in one, or once the model is deleted. */
  @Column({ name: 'model_id', type: 'int', unsigned: true, nullable: true })
  modelId: number | null;

  @Column({ type: 'varchar', length: 64, nullable: true })
  family: string | null;

  @Column({ type: 'varchar', length: 200 })
  name: string;

  @Column({ type: 'enum', enum: SCAN_METHODS })
  method: ScanMethod;

  @Column({ type: 'enum', enum: SCAN_STATUSES, default: 'draft' })
  status: ScanStatus;

  /** The full specification as submitted, read back through the shared stored-spec schema. */
  @Column({ type: 'json', transformer: STORED_SPEC })
  spec: StoredScanSpec;

  /** What the submission recorded of the build and the engine's settings; null for scans stored before it was recorded. */
  @Column({ type: 'json', nullable: true, transformer: PROVENANCE })
  provenance: ScanProvenance | null;

  @Column({ type: 'text' })
  note: string;

  @Column({ name: 'total_points', type: 'int', unsigned: true, default: 0 })
  totalPoints: number;

  @Column({ name: 'done_points', type: 'int', unsigned: true, default: 0 })
  donePoints: number;

  @Column({ name: 'failed_points', type: 'int', unsigned: true, default: 0 })
  failedPoints: number;

  @CreateDateColumn({ name: 'created_at', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', onUpdate: 'CURRENT_TIMESTAMP(3)' })
  updatedAt: Date;

  @Column({ name: 'queued_at', type: 'datetime', precision: 3, nullable: true })
  queuedAt: Date | null;

  @Column({ name: 'started_at', type: 'datetime', precision: 3, nullable: true })
  startedAt: Date | null;

  @Column({ name: 'finished_at', type: 'datetime', precision: 3, nullable: true })
  finishedAt: Date | null;

  /** Set once the owner has been told the scan finished; cleared when a retry runs it again. */
  @Column({ name: 'finish_notified_at', type: 'datetime', precision: 3, nullable: true })
  finishNotifiedAt: Date | null;

  /** On a refinement level: the grid scan its chain refines (see `RefinementsService`). */
  @Column({ name: 'refines_scan_id', type: 'int', unsigned: true, nullable: true })
  refinesScanId: number | null;

  /** On a refinement level: the scan it follows (the parent for level 1, the level before after). */
  @Column({ name: 'follows_scan_id', type: 'int', unsigned: true, nullable: true })
  followsScanId: number | null;

  @Column({ name: 'refinement_level', type: 'tinyint', unsigned: true, nullable: true })
  refinementLevel: number | null;

  /** Set once the API decided what follows this finished level: the next level, or none. */
  @Column({ name: 'refinement_followed_at', type: 'datetime', precision: 3, nullable: true })
  refinementFollowedAt: Date | null;

  @ManyToOne(() => Group, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'group_id' })
  group: Group;

  @ManyToOne(() => User, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'owner_id' })
  owner: User;

  // A scan keeps its model's definition in its spec, so deleting the model leaves it whole.
  @ManyToOne(() => PotentialModel, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'model_id' })
  model: PotentialModel | null;

  @OneToMany('ScanTag', (t: ScanTag) => t.scan, { cascade: true })
  tags: ScanTag[];
}
