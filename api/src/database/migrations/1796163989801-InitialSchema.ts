import { MigrationInterface, QueryRunner } from "typeorm";

export class InitialSchema1796163989801 implements MigrationInterface {
    name = 'InitialSchema1796163989801'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`users\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`email\` varchar(254) NOT NULL, \`display_name\` varchar(120) NOT NULL, \`password_hash\` varchar(255) NOT NULL, \`site_role\` enum ('admin', 'user') NOT NULL DEFAULT 'user', \`last_login_at\` datetime(3) NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), UNIQUE INDEX \`uq_users_email\` (\`email\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`audit_events\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`action\` varchar(64) NOT NULL, \`actor_id\` int UNSIGNED NULL, \`group_id\` int UNSIGNED NULL, \`target_type\` varchar(32) NULL, \`target_id\` varchar(64) NULL, \`details\` json NOT NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`ix_audit_events_group\` (\`group_id\`), INDEX \`ix_audit_events_actor\` (\`actor_id\`), INDEX \`ix_audit_events_action_created\` (\`action\`, \`created_at\`), INDEX \`ix_audit_events_created\` (\`created_at\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`groups\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`slug\` varchar(64) NOT NULL, \`name\` varchar(120) NOT NULL, \`description\` varchar(1000) NOT NULL DEFAULT '', \`point_limit\` int UNSIGNED NOT NULL DEFAULT '1000000', \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`uq_groups_slug\` (\`slug\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`potential_models\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`group_id\` int UNSIGNED NOT NULL, \`name\` varchar(120) NOT NULL, \`expression\` text NOT NULL, \`parameters\` json NOT NULL, \`phi_init\` double NULL, \`description\` varchar(2000) NOT NULL DEFAULT '', \`created_by_id\` int UNSIGNED NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), UNIQUE INDEX \`uq_potential_models_group_name\` (\`group_id\`, \`name\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`scans\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`group_id\` int UNSIGNED NOT NULL, \`owner_id\` int UNSIGNED NOT NULL, \`model_id\` int UNSIGNED NULL, \`family\` varchar(64) NULL, \`name\` varchar(200) NOT NULL, \`method\` enum ('slowroll', 'exact') NOT NULL, \`status\` enum ('draft', 'queued', 'running', 'completed', 'failed', 'cancelled') NOT NULL DEFAULT 'draft', \`spec\` json NOT NULL, \`note\` text NOT NULL, \`total_points\` int UNSIGNED NOT NULL DEFAULT '0', \`done_points\` int UNSIGNED NOT NULL DEFAULT '0', \`failed_points\` int UNSIGNED NOT NULL DEFAULT '0', \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), \`queued_at\` datetime(3) NULL, \`started_at\` datetime(3) NULL, \`finished_at\` datetime(3) NULL, INDEX \`ix_scans_status\` (\`status\`), INDEX \`ix_scans_owner\` (\`owner_id\`), INDEX \`ix_scans_group_created\` (\`group_id\`, \`created_at\`), INDEX \`ix_scans_group_status\` (\`group_id\`, \`status\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`comments\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`scan_id\` int UNSIGNED NOT NULL, \`point_index\` int UNSIGNED NULL, \`author_id\` int UNSIGNED NOT NULL, \`body\` text NOT NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), INDEX \`ix_comments_scan_point\` (\`scan_id\`, \`point_index\`, \`created_at\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`memberships\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`group_id\` int UNSIGNED NOT NULL, \`user_id\` int UNSIGNED NOT NULL, \`role\` enum ('lead', 'member', 'viewer') NOT NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`ix_memberships_user\` (\`user_id\`), UNIQUE INDEX \`uq_memberships_group_user\` (\`group_id\`, \`user_id\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`scan_points\` (\`scan_id\` int UNSIGNED NOT NULL, \`point_index\` int UNSIGNED NOT NULL, \`inputs\` json NOT NULL, \`status\` varchar(32) NOT NULL, \`failure_reason\` varchar(500) NULL, \`ns\` double NULL, \`r\` double NULL, \`alpha_s\` double NULL, \`a_s\` double NULL, \`amplitude_scale\` double NULL, \`n_total\` double NULL, \`n_star\` double NULL, \`phi_star\` double NULL, \`phi_end\` double NULL, \`energy_scale_gev\` double NULL, \`computed_at\` datetime(3) NOT NULL, INDEX \`ix_scan_points_scan_r\` (\`scan_id\`, \`r\`), INDEX \`ix_scan_points_scan_ns\` (\`scan_id\`, \`ns\`), INDEX \`ix_scan_points_scan_status\` (\`scan_id\`, \`status\`), PRIMARY KEY (\`scan_id\`, \`point_index\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`scan_tags\` (\`scan_id\` int UNSIGNED NOT NULL, \`tag\` varchar(64) NOT NULL, INDEX \`ix_scan_tags_tag\` (\`tag\`), PRIMARY KEY (\`scan_id\`, \`tag\`)) ENGINE=InnoDB`);
        await queryRunner.query(`ALTER TABLE \`audit_events\` ADD CONSTRAINT \`FK_04c7c044146c6632491a370fc04\` FOREIGN KEY (\`actor_id\`) REFERENCES \`users\`(\`id\`) ON DELETE SET NULL ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`potential_models\` ADD CONSTRAINT \`FK_e497c8529162ca9490756b9f78d\` FOREIGN KEY (\`group_id\`) REFERENCES \`groups\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`potential_models\` ADD CONSTRAINT \`FK_69ded75505b987f6c161619c002\` FOREIGN KEY (\`created_by_id\`) REFERENCES \`users\`(\`id\`) ON DELETE SET NULL ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`scans\` ADD CONSTRAINT \`FK_48636fe1a63c655473c33c60c58\` FOREIGN KEY (\`group_id\`) REFERENCES \`groups\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`scans\` ADD CONSTRAINT \`FK_13acd0ad207acda9012072b7699\` FOREIGN KEY (\`owner_id\`) REFERENCES \`users\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`scans\` ADD CONSTRAINT \`FK_ab68b56f9575e880608d687407c\` FOREIGN KEY (\`model_id\`) REFERENCES \`potential_models\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`comments\` ADD CONSTRAINT \`FK_2d53280e2476fa8d455695bd626\` FOREIGN KEY (\`scan_id\`) REFERENCES \`scans\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`comments\` ADD CONSTRAINT \`FK_e6d38899c31997c45d128a8973b\` FOREIGN KEY (\`author_id\`) REFERENCES \`users\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`memberships\` ADD CONSTRAINT \`FK_253a15e6c430fc2e5bb84c4afda\` FOREIGN KEY (\`group_id\`) REFERENCES \`groups\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`memberships\` ADD CONSTRAINT \`FK_7c1e2fdfed4f6838e0c05ae5051\` FOREIGN KEY (\`user_id\`) REFERENCES \`users\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`scan_points\` ADD CONSTRAINT \`FK_e3f12b02dfb9c587b5be17441cd\` FOREIGN KEY (\`scan_id\`) REFERENCES \`scans\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`scan_tags\` ADD CONSTRAINT \`FK_e5e7a71e30faba612127ecbdf3c\` FOREIGN KEY (\`scan_id\`) REFERENCES \`scans\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`scan_tags\` DROP FOREIGN KEY \`FK_e5e7a71e30faba612127ecbdf3c\``);
        await queryRunner.query(`ALTER TABLE \`scan_points\` DROP FOREIGN KEY \`FK_e3f12b02dfb9c587b5be17441cd\``);
        await queryRunner.query(`ALTER TABLE \`memberships\` DROP FOREIGN KEY \`FK_7c1e2fdfed4f6838e0c05ae5051\``);
        await queryRunner.query(`ALTER TABLE \`memberships\` DROP FOREIGN KEY \`FK_253a15e6c430fc2e5bb84c4afda\``);
        await queryRunner.query(`ALTER TABLE \`comments\` DROP FOREIGN KEY \`FK_e6d38899c31997c45d128a8973b\``);
        await queryRunner.query(`ALTER TABLE \`comments\` DROP FOREIGN KEY \`FK_2d53280e2476fa8d455695bd626\``);
        await queryRunner.query(`ALTER TABLE \`scans\` DROP FOREIGN KEY \`FK_ab68b56f9575e880608d687407c\``);
        await queryRunner.query(`ALTER TABLE \`scans\` DROP FOREIGN KEY \`FK_13acd0ad207acda9012072b7699\``);
        await queryRunner.query(`ALTER TABLE \`scans\` DROP FOREIGN KEY \`FK_48636fe1a63c655473c33c60c58\``);
        await queryRunner.query(`ALTER TABLE \`potential_models\` DROP FOREIGN KEY \`FK_69ded75505b987f6c161619c002\``);
        await queryRunner.query(`ALTER TABLE \`potential_models\` DROP FOREIGN KEY \`FK_e497c8529162ca9490756b9f78d\``);
        await queryRunner.query(`ALTER TABLE \`audit_events\` DROP FOREIGN KEY \`FK_04c7c044146c6632491a370fc04\``);
        await queryRunner.query(`DROP INDEX \`ix_scan_tags_tag\` ON \`scan_tags\``);
        await queryRunner.query(`DROP TABLE \`scan_tags\``);
        await queryRunner.query(`DROP INDEX \`ix_scan_points_scan_status\` ON \`scan_points\``);
        await queryRunner.query(`DROP INDEX \`ix_scan_points_scan_ns\` ON \`scan_points\``);
        await queryRunner.query(`DROP INDEX \`ix_scan_points_scan_r\` ON \`scan_points\``);
        await queryRunner.query(`DROP TABLE \`scan_points\``);
        await queryRunner.query(`DROP INDEX \`uq_memberships_group_user\` ON \`memberships\``);
        await queryRunner.query(`DROP INDEX \`ix_memberships_user\` ON \`memberships\``);
        await queryRunner.query(`DROP TABLE \`memberships\``);
        await queryRunner.query(`DROP INDEX \`ix_comments_scan_point\` ON \`comments\``);
        await queryRunner.query(`DROP TABLE \`comments\``);
        await queryRunner.query(`DROP INDEX \`ix_scans_group_status\` ON \`scans\``);
        await queryRunner.query(`DROP INDEX \`ix_scans_group_created\` ON \`scans\``);
        await queryRunner.query(`DROP INDEX \`ix_scans_owner\` ON \`scans\``);
        await queryRunner.query(`DROP INDEX \`ix_scans_status\` ON \`scans\``);
        await queryRunner.query(`DROP TABLE \`scans\``);
        await queryRunner.query(`DROP INDEX \`uq_potential_models_group_name\` ON \`potential_models\``);
        await queryRunner.query(`DROP TABLE \`potential_models\``);
        await queryRunner.query(`DROP INDEX \`uq_groups_slug\` ON \`groups\``);
        await queryRunner.query(`DROP TABLE \`groups\``);
        await queryRunner.query(`DROP INDEX \`ix_audit_events_created\` ON \`audit_events\``);
        await queryRunner.query(`DROP INDEX \`ix_audit_events_action_created\` ON \`audit_events\``);
        await queryRunner.query(`DROP INDEX \`ix_audit_events_actor\` ON \`audit_events\``);
        await queryRunner.query(`DROP INDEX \`ix_audit_events_group\` ON \`audit_events\``);
        await queryRunner.query(`DROP TABLE \`audit_events\``);
        await queryRunner.query(`DROP INDEX \`uq_users_email\` ON \`users\``);
        await queryRunner.query(`DROP TABLE \`users\``);
    }

}
