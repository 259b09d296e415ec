import { MigrationInterface, QueryRunner } from "typeorm";

export class Maintenance1796300000002 implements MigrationInterface {
    name = 'Maintenance1796300000002'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`scan_archives\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`scan_id\` int UNSIGNED NOT NULL, \`scan_name\` varchar(200) NOT NULL, \`group_id\` int UNSIGNED NOT NULL, \`file_name\` varchar(200) NOT NULL, \`bytes\` bigint UNSIGNED NOT NULL, \`sha256\` char(64) NOT NULL, \`points\` int UNSIGNED NOT NULL, \`created_by\` int UNSIGNED NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`ix_scan_archives_group_created\` (\`group_id\`, \`created_at\`), INDEX \`ix_scan_archives_scan\` (\`scan_id\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`ALTER TABLE \`scan_archives\` ADD CONSTRAINT \`fk_scan_archives_created_by\` FOREIGN KEY (\`created_by\`) REFERENCES \`users\`(\`id\`) ON DELETE SET NULL ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`groups\` ADD \`retention_days\` int UNSIGNED NULL`);
        await queryRunner.query(`ALTER TABLE \`groups\` ADD \`retention_statuses\` varchar(100) NOT NULL DEFAULT 'completed,failed,cancelled'`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`groups\` DROP COLUMN \`retention_statuses\``);
        await queryRunner.query(`ALTER TABLE \`groups\` DROP COLUMN \`retention_days\``);
        await queryRunner.query(`ALTER TABLE \`scan_archives\` DROP FOREIGN KEY \`fk_scan_archives_created_by\``);
        await queryRunner.query(`DROP TABLE \`scan_archives\``);
    }

}
