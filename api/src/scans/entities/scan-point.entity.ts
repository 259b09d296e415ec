import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { Scan } from './scan.entity';

/**
 * One computed grid point. The primary key (scan, point index) makes a retried chunk
 * overwrite its rows instead of adding new ones.
 */
@Entity('scan_points')
@Index('ix_scan_points_scan_status', ['scanId', 'status'])
@Index('ix_scan_points_scan_ns', ['scanId', 'ns'])
@Index('ix_scan_points_scan_r', ['scanId', 'r'])
export class ScanPoint {
  @PrimaryColumn({ name: 'scan_id', type: 'int', unsigned: true })
  scanId: number;

  @PrimaryColumn({ name: 'point_index', type: 'int', unsigned: true })
  pointIndex: number;

  /** Parameter values and N_* settings of this point, by name. */
  @Column({ type: 'json' })
  inputs: Record<string, number>;

  /** `ok` or an engine failure code (no_end, insufficient_efolds, ...). */
  @Column({ type: 'varchar', length: 32 })
  status: string;

  /** The engine's plain-language reason when status is not ok. */
  @Column({ name: 'failure_reason', type: 'varchar', length: 500, nullable: true })
  failureReason: string | null;

  @Column({ type: 'double', nullable: true }) ns: number | null;
  @Column({ type: 'double', nullable: true }) r: number | null;
  @Column({ name: 'alpha_s', type: 'double', nullable: true }) alphaS: number | null;
  @Column({ name: 'a_s', type: 'double', nullable: true }) As: number | null;
  @Column({ name: 'amplitude_scale', type: 'double', nullable: true }) amplitudeScale: number | null;
  @Column({ name: 'n_total', type: 'double', nullable: true }) nTotal: number | null;
  @Column({ name: 'n_star', type: 'double', nullable: true }) nStar: number | null;
  @Column({ name: 'phi_star', type: 'double', nullable: true }) phiStar: number | null;
  @Column({ name: 'phi_end', type: 'double', nullable: true }) phiEnd: number | null;
  @Column({ name: 'energy_scale_gev', type: 'double', nullable: true }) energyScaleGeV: number | null;

  @Column({ name: 'computed_at', type: 'datetime', precision: 3 })
  computedAt: Date;

  @ManyToOne(() => Scan, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'scan_id' })
  scan: Scan;
}
