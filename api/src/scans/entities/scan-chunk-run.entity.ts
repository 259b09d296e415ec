import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { Scan } from './scan.entity';

/**
 * One chunk job a worker computed and stored, written in the same transaction as the chunk's
 * points: which process, on which build, and when. A retried chunk keeps a row per run that stored.
 */
@Entity('scan_chunk_runs')
@Index('ix_scan_chunk_runs_scan', ['scanId', 'chunk'])
export class ScanChunkRun {
  @PrimaryGeneratedColumn({ type: 'bigint', unsigned: true })
  id: string;

  @Column({ name: 'scan_id', type: 'int', unsigned: true })
  scanId: number;

  @Column({ type: 'int', unsigned: true })
  chunk: number;

  /** Positions [start, end) in the scan's compute order. */
  @Column({ name: 'start_position', type: 'int', unsigned: true })
  start: number;

  @Column({ name: 'end_position', type: 'int', unsigned: true })
  end: number;

  /** `hostname:pid` of the worker process. */
  @Column({ type: 'varchar', length: 255 })
  worker: string;

  @Column({ name: 'engine_version', type: 'varchar', length: 32 })
  engineVersion: string;

  @Column({ name: 'engine_commit', type: 'varchar', length: 64 })
  commit: string;

  @Column({ name: 'node_version', type: 'varchar', length: 32 })
  node: string;

  @Column({ name: 'point_time_limit_ms', type: 'int', unsigned: true })
  pointTimeLimitMs: number;

  @Column({ name: 'started_at', type: 'datetime', precision: 3 })
  startedAt: Date;

  @Column({ name: 'finished_at', type: 'datetime', precision: 3 })
  finishedAt: Date;

  @ManyToOne(() => Scan, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'scan_id' })
  scan: Scan;
}
