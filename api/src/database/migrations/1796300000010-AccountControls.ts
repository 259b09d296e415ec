import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Accounts can be disabled and their sessions ended (users.disabled_at, users.session_epoch);
 * API tokens always expire and may be read-only. Tokens that had no expiry get one 90 days after
 * this migration runs, so scripts keep working for a while and their owners can replace them.
 */
export class AccountControls1796300000010 implements MigrationInterface {
  name = 'AccountControls1796300000010';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE `users` ADD `disabled_at` datetime(3) NULL, ADD `session_epoch` int UNSIGNED NOT NULL DEFAULT 0');
    // UTC, as the API reads and writes every datetime (timezone 'Z'), whatever the server's zone.
    await queryRunner.query('UPDATE `api_tokens` SET `expires_at` = UTC_TIMESTAMP(3) + INTERVAL 90 DAY WHERE `expires_at` IS NULL');
    await queryRunner.query('ALTER TABLE `api_tokens` MODIFY `expires_at` datetime(3) NOT NULL, ADD `read_only` tinyint NOT NULL DEFAULT 0');
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    // The expiry given to tokens that had none stays: nothing records which ones they were.
    await queryRunner.query('ALTER TABLE `api_tokens` DROP COLUMN `read_only`, MODIFY `expires_at` datetime(3) NULL');
    await queryRunner.query('ALTER TABLE `users` DROP COLUMN `session_epoch`, DROP COLUMN `disabled_at`');
  }
}
