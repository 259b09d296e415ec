import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Reproducibility checks: a random sample of a scan's OK points recomputed by a worker, and the comparison. */
export class ScanReproductions1796300000041 implements MigrationInterface {
  name = 'ScanReproductions1796300000041';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`CREATE TABLE \`scan_reproductions\` (
      \`id\` int unsigned NOT NULL AUTO_INCREMENT,
      \`scan_id\` int unsigned NOT NULL,
      \`requested_by_id\` int unsigned NULL,
      \`status\` enum('queued', 'running', 'completed', 'failed') NOT NULL DEFAULT 'queued',
      \`sample_size\` int unsigned NOT NULL,
      \`point_indices\` json NOT NULL,
      \`scan_build\` json NULL,
      \`checked_build\` json NULL,
      \`recomputed\` json NULL,
      \`report\` json NULL,
      \`error\` varchar(1000) NULL,
      \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      \`finished_at\` datetime(3) NULL,
      INDEX \`ix_scan_reproductions_scan\` (\`scan_id\`, \`created_at\`),
      PRIMARY KEY (\`id\`),
      CONSTRAINT \`fk_scan_reproductions_scan\` FOREIGN KEY (\`scan_id\`) REFERENCES \`scans\` (\`id\`) ON DELETE CASCADE,
      CONSTRAINT \`fk_scan_reproductions_requested_by\` FOREIGN KEY (\`requested_by_id\`) REFERENCES \`users\` (\`id\`) ON DELETE SET NULL
    ) ENGINE=InnoDB`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE `scan_reproductions`');
  }
}
