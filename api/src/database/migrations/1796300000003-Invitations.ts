import { MigrationInterface, QueryRunner } from "typeorm";

export class Invitations1796300000003 implements MigrationInterface {
    name = 'Invitations1796300000003'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`invitations\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`group_id\` int UNSIGNED NOT NULL, \`email\` varchar(254) NOT NULL, \`role\` enum ('lead', 'member', 'viewer') NOT NULL, \`invited_by_id\` int UNSIGNED NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`expires_at\` datetime(3) NOT NULL, \`accepted_at\` datetime(3) NULL, \`accepted_by_id\` int UNSIGNED NULL, \`revoked_at\` datetime(3) NULL, INDEX \`ix_invitations_group_email\` (\`group_id\`, \`email\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`ALTER TABLE \`invitations\` ADD CONSTRAINT \`fk_invitations_group\` FOREIGN KEY (\`group_id\`) REFERENCES \`groups\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`invitations\` ADD CONSTRAINT \`fk_invitations_invited_by\` FOREIGN KEY (\`invited_by_id\`) REFERENCES \`users\`(\`id\`) ON DELETE SET NULL ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`invitations\` ADD CONSTRAINT \`fk_invitations_accepted_by\` FOREIGN KEY (\`accepted_by_id\`) REFERENCES \`users\`(\`id\`) ON DELETE SET NULL ON UPDATE NO ACTION`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`invitations\` DROP FOREIGN KEY \`fk_invitations_accepted_by\``);
        await queryRunner.query(`ALTER TABLE \`invitations\` DROP FOREIGN KEY \`fk_invitations_invited_by\``);
        await queryRunner.query(`ALTER TABLE \`invitations\` DROP FOREIGN KEY \`fk_invitations_group\``);
        await queryRunner.query(`DROP TABLE \`invitations\``);
    }

}
