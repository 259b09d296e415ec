import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Indexes of scan_points dropped here; what serves those sorts now is in DEVELOPERS.md ("Axis columns"). */
const DROPPED = ['amplitude_scale', 'n_total', 'n_star', 'phi_star', 'phi_end', 'energy_scale_gev', 'axis_0', 'axis_1', 'axis_2', 'axis_3'];

/**
 * Every secondary index of scan_points costs each stored point an insert into one more B-tree:
 * with fifteen of them MariaDB spent ~45 s of CPU storing a 10^6-point scan, about five times what the
 * engine spent computing it. Kept: status and the four observables people sort and filter by
 * (n_s, r, α_s, A_s). Sorting a completed grid by an axis input needs no index (its order follows
 * from the axes, `inputSortedOrder`); the rarer outputs sort without one.
 */
export class LeanPointIndexes1796300000021 implements MigrationInterface {
  name = 'LeanPointIndexes1796300000021';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`scan_points\` ${DROPPED.map((c) => `DROP INDEX \`ix_scan_points_scan_${c}\``).join(', ')}`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`scan_points\` ${DROPPED.map((c) => `ADD INDEX \`ix_scan_points_scan_${c}\` (\`scan_id\`, \`${c}\`)`).join(', ')}`);
  }
}
