import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { REPRODUCTION_STATUSES, type BuildInfo, type ReproducedPoint, type ReproductionReport, type ReproductionStatus } from '@sixtyfold/shared';
import { Scan } from '../../scans/entities/scan.entity';
import { User } from '../../users/entities/user.entity';

/**
 * One reproducibility check of a scan: the sampled point indices (chosen at request), the worker's
 * recomputed outputs and the comparison with the stored ones. The API creates it, a worker fills it.
 */
@Entity('scan_reproductions')
@Index('ix_scan_reproductions_scan', ['scanId', 'createdAt'])
export class ScanReproduction {
  @PrimaryGeneratedColumn({ unsigned: true })
  id: number;

  @Column({ name: 'scan_id', type: 'int', unsigned: true })
  scanId: number;

  @Column({ name: 'requested_by_id', type: 'int', unsigned: true, nullable: true })
  requestedById: number | null;

  @Column({ type: 'enum', enum: REPRODUCTION_STATUSES, default: 'queued' })
  status: ReproductionStatus;

  @Column({ name: 'sample_size', type: 'int', unsigned: true })
  sampleSize: number;

  /** The sample, ascending. */
  @Column({ name: 'point_indices', type: 'json' })
  pointIndices: number[];

  /** The build the scan was submitted with (its provenance), null when not recorded. */
  @Column({ name: 'scan_build', type: 'json', nullable: true })
  scanBuild: BuildInfo | null;

  @Column({ name: 'checked_build', type: 'json', nullable: true })
  checkedBuild: (BuildInfo & { worker: string }) | null;

  @Column({ type: 'json', nullable: true })
  recomputed: ReproducedPoint[] | null;

  @Column({ type: 'json', nullable: true })
  report: ReproductionReport | null;

  @Column({ type: 'varchar', length: 1000, nullable: true })
  error: string | null;

  @CreateDateColumn({ name: 'created_at', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;

  @Column({ name: 'finished_at', type: 'datetime', precision: 3, nullable: true })
  finishedAt: Date | null;

  @ManyToOne(() => Scan, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'scan_id' })
  scan: Scan;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'requested_by_id' })
  requestedBy: User | null;
}
