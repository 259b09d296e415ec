import { Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { Scan } from './scan.entity';

/** Tags live in their own table so that "all scans tagged X" is an index look-up. */
@Entity('scan_tags')
@Index('ix_scan_tags_tag', ['tag'])
export class ScanTag {
  @PrimaryColumn({ name: 'scan_id', type: 'int', unsigned: true })
  scanId: number;

  @PrimaryColumn({ type: 'varchar', length: 64 })
  tag: string;

  @ManyToOne(() => Scan, (s) => s.tags, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'scan_id' })
  scan: Scan;
}
