import { MigrationInterface, QueryRunner } from 'typeorm';

export class Uploads1796300000001 implements MigrationInterface {
  name = 'Uploads1796300000001';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      'CREATE TABLE `constraint_regions` (`id` int UNSIGNED NOT NULL AUTO_INCREMENT, `group_id` int UNSIGNED NOT NULL, `name` varchar(120) NOT NULL, ' +
        '`source` varchar(500) NOT NULL, `confidence_level` double NOT NULL, `vertices` json NOT NULL, `created_by_id` int UNSIGNED NULL, ' +
        '`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX `ix_constraint_regions_group` (`group_id`), PRIMARY KEY (`id`)) ENGINE=InnoDB',
    );
    await queryRunner.query(
      'ALTER TABLE `constraint_regions` ADD CONSTRAINT `FK_constraint_regions_group` FOREIGN KEY (`group_id`) REFERENCES `groups`(`id`) ON DELETE CASCADE ON UPDATE NO ACTION',
    );
    await queryRunner.query(
      'ALTER TABLE `constraint_regions` ADD CONSTRAINT `FK_constraint_regions_created_by` FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON DELETE SET NULL ON UPDATE NO ACTION',
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE `constraint_regions` DROP FOREIGN KEY `FK_constraint_regions_created_by`');
    await queryRunner.query('ALTER TABLE `constraint_regions` DROP FOREIGN KEY `FK_constraint_regions_group`');
    await queryRunner.query('DROP TABLE `constraint_regions`');
  }
}
