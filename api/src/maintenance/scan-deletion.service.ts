import { ConflictException, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import type { ScanStatus } from '@sixtyfold/shared';
import { scanLifecycle } from '../database/scan-lifecycle';
import { ScanArchivesService } from './scan-archives.service';

export type DeletionReason = 'manual' | 'prune' | 'retention';

export interface DeletedScan {
  scanId: number;
  archiveId: number;
  points: number;
}

/** The one way a scan is deleted: archived first, then removed (its points cascade), then on record. */
@Injectable()
export class ScanDeletionService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly archives: ScanArchivesService,
    private readonly audit: AuditService,
  ) {}

  /**
   * `onlyFinished` refuses a scan that is queued or running by the time it is locked (a prune
   * never stops live work); a lead's single delete may remove a live scan, which is cancelled first.
   */
  async delete(scanId: number, actorId: number | null, reason: DeletionReason, onlyFinished: boolean): Promise<DeletedScan> {
    const archive = await this.archives.write(scanId, actorId);
    await this.db.transaction(async (tx) => {
      const [locked]: { status: ScanStatus; group_id: number; name: string; owner_id: number; total_points: number }[] = await tx.query(
        'SELECT status, group_id, name, owner_id, total_points FROM scans WHERE id = ? FOR UPDATE', [scanId],
      );
      if (!locked) throw new ConflictException(`Scan ${scanId} was already deleted`);
      if (onlyFinished && (locked.status === 'queued' || locked.status === 'running')) {
        throw new ConflictException(`Scan ${scanId} is ${locked.status} again; a queued or running scan is never pruned`);
      }
      await this.audit.record({
        action: 'scan.delete', actorId, groupId: locked.group_id, targetType: 'scan', targetId: scanId,
        // points: the scan's grid size, as before; archivedPoints: the rows the archive holds.
        details: { reason, archiveId: archive.id, points: Number(locked.total_points), archivedPoints: archive.points, name: locked.name, owner: locked.owner_id },
      }, tx);
      await scanLifecycle.remove(tx, scanId, locked.status, reason === 'manual' ? 'lead' : 'maintenance');
    });
    return { scanId, archiveId: archive.id, points: archive.points };
  }
}
