import type { MigrationInterface, QueryRunner } from 'typeorm';

const AXES = [0, 1, 2, 3];
const OUTPUTS = ['alpha_s', 'a_s', 'amplitude_scale', 'n_total', 'n_star', 'phi_star', 'phi_end', 'energy_scale_gev'];

/**
 * The first four varied inputs of each point as numeric columns `axis_0`…`axis_3` (order of
 * `variedInputs(spec)`: the axes, or a point list's columns), and an index (scan_id, column) on
 * each of them and on every output a points page sorts by, so that any page is an index walk.
 * Stored points get their axis values from their JSON `inputs`, one UPDATE per scan.
 */
export class PointAxisColumns1796300000020 implements MigrationInterface {
  name = 'PointAxisColumns1796300000020';

  public async up(queryRunner: QueryRunner): Promise<void> {
    const columns = AXES.map((k) => `ADD \`axis_${k}\` double NULL`);
    const indexes = [...OUTPUTS, ...AXES.map((k) => `axis_${k}`)].map((c) => `ADD INDEX \`ix_scan_points_scan_${c}\` (\`scan_id\`, \`${c}\`)`);
    await queryRunner.query(`ALTER TABLE \`scan_points\` ${[...columns, ...indexes].join(', ')}`);
    const scans: { id: number; parameters: string | string[] | null }[] = await queryRunner.query(
      `SELECT id, COALESCE(JSON_EXTRACT(spec, '$.pointList.columns'), JSON_EXTRACT(spec, '$.axes[*].parameter')) AS parameters
         FROM scans WHERE id IN (SELECT DISTINCT scan_id FROM scan_points)`,
    );
    for (const scan of scans) {
      const parameters: string[] = typeof scan.parameters === 'string' ? JSON.parse(scan.parameters) : (scan.parameters ?? []);
      const sets = parameters.slice(0, AXES.length).map((name, k) => {
        // Input names match [A-Za-z][A-Za-z0-9_]* (the spec schema), so the quoted JSON path is safe.
        return `\`axis_${k}\` = CAST(JSON_VALUE(\`inputs\`, '$."${name}"') AS DOUBLE)`;
      });
      if (sets.length) await queryRunner.query(`UPDATE \`scan_points\` SET ${sets.join(', ')} WHERE \`scan_id\` = ?`, [scan.id]);
    }
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    const indexes = [...OUTPUTS, ...AXES.map((k) => `axis_${k}`)].map((c) => `DROP INDEX \`ix_scan_points_scan_${c}\``);
    await queryRunner.query(`ALTER TABLE \`scan_points\` ${[...indexes, ...AXES.map((k) => `DROP COLUMN \`axis_${k}\``)].join(', ')}`);
  }
}
