import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * What computed a scan: `scans.provenance` (the submitting build, the resolved integrator settings
 * and the spec's hash; NULL for scans stored before, shown as "not recorded") and one
 * `scan_chunk_runs` row per chunk job a worker stored (its worker, build and times).
 */
export class ScanProvenance1796300000040 implements MigrationInterface {
  name = 'ScanProvenance1796300000040';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE `scans` ADD `provenance` json NULL');
    await queryRunner.query(`CREATE TABLE \`scan_chunk_runs\` (
      \`id\` bigint unsigned NOT NULL AUTO_INCREMENT,
      \`scan_id\` int unsigned NOT NULL,
      \`chunk\` int unsigned NOT NULL,
      \`start_position\` int unsigned NOT NULL,
      \`end_position\` int unsigned NOT NULL,
      \`worker\` varchar(255) NOT NULL,
      \`engine_version\` varchar(32) NOT NULL,
      \`engine_commit\` varchar(64) NOT NULL,
      \`node_version\` varchar(32) NOT NULL,
      \`point_time_limit_ms\` int unsigned NOT NULL,
      \`started_at\` datetime(3) NOT NULL,
      \`finished_at\` datetime(3) NOT NULL,
      INDEX \`ix_scan_chunk_runs_scan\` (\`scan_id\`, \`chunk\`),
      PRIMARY KEY (\`id\`),
      CONSTRAINT \`fk_scan_chunk_runs_scan\` FOREIGN KEY (\`scan_id\`) REFERENCES \`scans\` (\`id\`) ON DELETE CASCADE
    ) ENGINE=InnoDB`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE `scan_chunk_runs`');
    await queryRunner.query('ALTER TABLE `scans` DROP COLUMN `provenance`');
  }
}
