import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from '../../users/entities/user.entity';

/**
 * One archive file written before a scan was deleted. No foreign key to the scan: the row
 * outlives it, and keeps the name and group so the file can still be found and authorised.
 */
@Entity('scan_archives')
@Index('ix_scan_archives_group_created', ['groupId', 'createdAt'])
@Index('ix_scan_archives_scan', ['scanId'])
export class ScanArchive {
  @PrimaryGeneratedColumn({ unsigned: true })
  id: number;

  @Column({ name: 'scan_id', type: 'int', unsigned: true })
  scanId: number;

  @Column({ name: 'scan_name', type: 'varchar', length: 200 })
  scanName: string;

  @Column({ name: 'group_id', type: 'int', unsigned: true })
  groupId: number;

  /** Inside the configured archive folder. */
  @Column({ name: 'file_name', type: 'varchar', length: 200 })
  fileName: string;

  @Column({ type: 'bigint', unsigned: true, transformer: { to: (v: number) => v, from: (v: string | null) => Number(v) } })
  bytes: number;

  @Column({ type: 'char', length: 64 })
  sha256: string;

  @Column({ type: 'int', unsigned: true })
  points: number;

  /** Null for the nightly retention run. */
  @Column({ name: 'created_by', type: 'int', unsigned: true, nullable: true })
  createdById: number | null;

  @CreateDateColumn({ name: 'created_at', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'created_by', foreignKeyConstraintName: 'fk_scan_archives_created_by' })
  createdBy: User | null;
}
