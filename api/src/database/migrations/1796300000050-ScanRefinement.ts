import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Refinement chains: a follow-up level names the grid scan it refines and the scan it follows
 * (the parent for level 1, level k − 1 after), its level, and when the API decided what follows it
 * (the next level created, or none), so each level is followed once.
 */
export class ScanRefinement1796300000050 implements MigrationInterface {
  name = 'ScanRefinement1796300000050';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`scans\`
      ADD \`refines_scan_id\` int unsigned NULL,
      ADD \`follows_scan_id\` int unsigned NULL,
      ADD \`refinement_level\` tinyint unsigned NULL,
      ADD \`refinement_followed_at\` datetime(3) NULL,
      ADD INDEX \`ix_scans_refines\` (\`refines_scan_id\`),
      ADD INDEX \`ix_scans_follows\` (\`follows_scan_id\`),
      ADD CONSTRAINT \`fk_scans_refines\` FOREIGN KEY (\`refines_scan_id\`) REFERENCES \`scans\` (\`id\`) ON DELETE SET NULL,
      ADD CONSTRAINT \`fk_scans_follows\` FOREIGN KEY (\`follows_scan_id\`) REFERENCES \`scans\` (\`id\`) ON DELETE SET NULL`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE \`scans\`
      DROP FOREIGN KEY \`fk_scans_refines\`, DROP FOREIGN KEY \`fk_scans_follows\`,
      DROP INDEX \`ix_scans_refines\`, DROP INDEX \`ix_scans_follows\`,
      DROP COLUMN \`refines_scan_id\`, DROP COLUMN \`follows_scan_id\`, DROP COLUMN \`refinement_level\`, DROP COLUMN \`refinement_followed_at\``);
  }
}
