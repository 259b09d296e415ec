import { MigrationInterface, QueryRunner } from "typeorm";

export class ScanModelSetNull1796193248504 implements MigrationInterface {
    name = 'ScanModelSetNull1796193248504'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`scans\` DROP FOREIGN KEY \`FK_ab68b56f9575e880608d687407c\``);
        await queryRunner.query(`ALTER TABLE \`scans\` ADD CONSTRAINT \`FK_ab68b56f9575e880608d687407c\` FOREIGN KEY (\`model_id\`) REFERENCES \`potential_models\`(\`id\`) ON DELETE SET NULL ON UPDATE NO ACTION`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`scans\` DROP FOREIGN KEY \`FK_ab68b56f9575e880608d687407c\``);
        await queryRunner.query(`ALTER TABLE \`scans\` ADD CONSTRAINT \`FK_ab68b56f9575e880608d687407c\` FOREIGN KEY (\`model_id\`) REFERENCES \`potential_models\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
    }

}
