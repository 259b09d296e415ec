import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Likelihood sets added by an admin, one row per version (the built-in sets live in code). */
export class LikelihoodSets1796300000030 implements MigrationInterface {
  name = 'LikelihoodSets1796300000030';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`CREATE TABLE \`likelihood_sets\` (
      \`id\` int unsigned NOT NULL AUTO_INCREMENT,
      \`set_key\` varchar(64) NOT NULL,
      \`version\` int unsigned NOT NULL,
      \`definition\` json NOT NULL,
      \`created_by_id\` int unsigned NULL,
      \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      UNIQUE INDEX \`uq_likelihood_sets_key_version\` (\`set_key\`, \`version\`),
      PRIMARY KEY (\`id\`),
      CONSTRAINT \`fk_likelihood_sets_created_by\` FOREIGN KEY (\`created_by_id\`) REFERENCES \`users\` (\`id\`) ON DELETE SET NULL
    ) ENGINE=InnoDB`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE `likelihood_sets`');
  }
}
