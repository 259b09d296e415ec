import { MigrationInterface, QueryRunner } from "typeorm";

export class CommentsAndNotifications1796300000004 implements MigrationInterface {
    name = 'CommentsAndNotifications1796300000004'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`comment_mentions\` (\`comment_id\` int UNSIGNED NOT NULL, \`user_id\` int UNSIGNED NOT NULL, INDEX \`ix_comment_mentions_user\` (\`user_id\`), PRIMARY KEY (\`comment_id\`, \`user_id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`ALTER TABLE \`comment_mentions\` ADD CONSTRAINT \`FK_comment_mentions_comment\` FOREIGN KEY (\`comment_id\`) REFERENCES \`comments\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`comment_mentions\` ADD CONSTRAINT \`FK_comment_mentions_user\` FOREIGN KEY (\`user_id\`) REFERENCES \`users\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`CREATE TABLE \`notifications\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`user_id\` int UNSIGNED NOT NULL, \`kind\` enum ('scan_completed', 'scan_failed', 'scan_cancelled', 'mentioned', 'invited') NOT NULL, \`payload\` json NOT NULL, \`event_key\` varchar(191) NOT NULL, \`read_at\` datetime(3) NULL, \`emailed_at\` datetime(3) NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`ix_notifications_unemailed\` (\`emailed_at\`, \`user_id\`), INDEX \`ix_notifications_user_created\` (\`user_id\`, \`created_at\`), UNIQUE INDEX \`uq_notifications_user_event\` (\`user_id\`, \`event_key\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`ALTER TABLE \`notifications\` ADD CONSTRAINT \`FK_notifications_user\` FOREIGN KEY (\`user_id\`) REFERENCES \`users\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`users\` ADD \`notification_email\` enum ('immediate', 'daily', 'never') NOT NULL DEFAULT 'immediate'`);
        await queryRunner.query(`ALTER TABLE \`scans\` ADD \`finish_notified_at\` datetime(3) NULL`);
        // Scans that finished before notifications existed are not announced all at once now.
        await queryRunner.query(`UPDATE \`scans\` SET \`finish_notified_at\` = CURRENT_TIMESTAMP(3) WHERE \`status\` IN ('completed', 'failed', 'cancelled')`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`scans\` DROP COLUMN \`finish_notified_at\``);
        await queryRunner.query(`ALTER TABLE \`users\` DROP COLUMN \`notification_email\``);
        await queryRunner.query(`ALTER TABLE \`notifications\` DROP FOREIGN KEY \`FK_notifications_user\``);
        await queryRunner.query(`DROP TABLE \`notifications\``);
        await queryRunner.query(`ALTER TABLE \`comment_mentions\` DROP FOREIGN KEY \`FK_comment_mentions_user\``);
        await queryRunner.query(`ALTER TABLE \`comment_mentions\` DROP FOREIGN KEY \`FK_comment_mentions_comment\``);
        await queryRunner.query(`DROP TABLE \`comment_mentions\``);
    }

}
