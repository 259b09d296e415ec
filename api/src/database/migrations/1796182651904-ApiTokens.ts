import { MigrationInterface, QueryRunner } from "typeorm";

export class ApiTokens1796182651904 implements MigrationInterface {
    name = 'ApiTokens1796182651904'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`api_tokens\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`user_id\` int UNSIGNED NOT NULL, \`name\` varchar(100) NOT NULL, \`token_hash\` char(64) NOT NULL, \`prefix\` varchar(16) NOT NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`last_used_at\` datetime(3) NULL, \`expires_at\` datetime(3) NULL, \`revoked_at\` datetime(3) NULL, UNIQUE INDEX \`uq_api_tokens_token_hash\` (\`token_hash\`), INDEX \`ix_api_tokens_user\` (\`user_id\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`ALTER TABLE \`api_tokens\` ADD CONSTRAINT \`FK_b74883f5884a42fd8496d389b25\` FOREIGN KEY (\`user_id\`) REFERENCES \`users\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`api_tokens\` DROP FOREIGN KEY \`FK_b74883f5884a42fd8496d389b25\``);
        await queryRunner.query(`DROP INDEX \`ix_api_tokens_user\` ON \`api_tokens\``);
        await queryRunner.query(`DROP INDEX \`uq_api_tokens_token_hash\` ON \`api_tokens\``);
        await queryRunner.query(`DROP TABLE \`api_tokens\``);
    }

}
