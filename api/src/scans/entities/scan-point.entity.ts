import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { Scan } from './scan.entity';

/** How many varied inputs get a numeric, indexed column of their own (a grid has at most 4 axes). */
export const AXIS_COLUMNS = 4;

/**
 * The axis columns of a point: the i-th varied input (`variedInputs(spec)` order) in `axis_i`,
 * null past the inputs. Sorts and filters by an input read these through their indexes instead of
 * the JSON `inputs`; a point list's columns past the fourth have none and are read from `inputs`.
 */
export function axisColumnValues(parameters: readonly string[], inputs: Record<string, number>): Pick<ScanPoint, 'axis0' | 'axis1' | 'axis2' | 'axis3'> {
  const at = (k: number) => (k < parameters.length ? inputs[parameters[k]] ?? null : null);
  return { axis0: at(0), axis1: at(1), axis2: at(2), axis3: at(3) };
}

/**
 * One computed grid point. The primary key (scan, point index) makes a retried chunk
 * overwrite its rows instead of adding new ones.
 */
@Entity('scan_points')
@Index('ix_scan_points_scan_status', ['scanId', 'status'])
@Index('ix_scan_points_scan_ns', ['scanId', 'ns'])
@Index('ix_scan_points_scan_r', ['scanId', 'r'])
// The other observables people sort and filter by. Each index costs every stored point an insert
// (migration LeanPointIndexes): the rarer outputs and the axis columns go without one.
@Index('ix_scan_points_scan_alpha_s', ['scanId', 'alphaS'])
@Index('ix_scan_points_scan_a_s', ['scanId', 'As'])
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

  /** The varied inputs as numbers, in the scan's order (see `axisColumnValues`). */
  @Column({ name: 'axis_0', type: 'double', nullable: true }) axis0: number | null;
  @Column({ name: 'axis_1', type: 'double', nullable: true }) axis1: number | null;
  @Column({ name: 'axis_2', type: 'double', nullable: true }) axis2: number | null;
  @Column({ name: 'axis_3', type: 'double', nullable: true }) axis3: number | null;

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
