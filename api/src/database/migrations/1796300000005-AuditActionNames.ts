import type { MigrationInterface, QueryRunner } from 'typeorm';

// Audit actions are `<what>.<verb>` (AUDIT_ACTIONS in the shared package); five were written in the past tense.
const RENAMED: [before: string, after: string][] = [
  ['model.created', 'model.create'],
  ['model.updated', 'model.update'],
  ['model.deleted', 'model.delete'],
  ['constraint-region.created', 'region.create'],
  ['constraint-region.deleted', 'region.delete'],
];

export class AuditActionNames1796300000005 implements MigrationInterface {
  name = 'AuditActionNames1796300000005';

  public async up(queryRunner: QueryRunner): Promise<void> {
    for (const [before, after] of RENAMED) await queryRunner.query('UPDATE `audit_events` SET `action` = ? WHERE `action` = ?', [after, before]);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    for (const [before, after] of RENAMED) await queryRunner.query('UPDATE `audit_events` SET `action` = ? WHERE `action` = ?', [before, after]);
  }
}
