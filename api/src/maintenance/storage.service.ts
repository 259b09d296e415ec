import { ForbiddenException, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import type { StorageReport, TableStorage } from '@sixtyfold/shared';
import type { SessionUser } from '../common/session-user';
import { MaintenanceAccessService } from './maintenance-access.service';

/** The tables that hold scan data; scan_points dominates. */
const SCAN_TABLES = ['scans', 'scan_points', 'scan_tags', 'scan_archives'];
/** The storage page lists this many of the largest scans. */
const LARGEST_SCANS = 500;

/**
 * Sizes from MariaDB's own figures (information_schema.TABLES). InnoDB reports sizes per table,
 * not per row, so a scan's bytes are its share: its stored points times scan_points' bytes per row.
 * TABLE_ROWS and the lengths are InnoDB's statistics, refreshed by InnoDB itself; no ANALYZE here,
 * since the figures only need to be close and ANALYZE would lock and rescan the largest table.
 */
@Injectable()
export class StorageService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly maintenanceAccess: MaintenanceAccessService,
  ) {}

  async tables(): Promise<TableStorage[]> {
    const rows: { name: string; rows: string | null; data: string | null; idx: string | null }[] = await this.db.query(
      `SELECT TABLE_NAME AS name, TABLE_ROWS AS \`rows\`, DATA_LENGTH AS data, INDEX_LENGTH AS idx
         FROM information_schema.TABLES WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME IN (?) ORDER BY TABLE_NAME`,
      [SCAN_TABLES],
    );
    return rows.map((r) => ({ table: r.name, rows: Number(r.rows ?? 0), dataBytes: Number(r.data ?? 0), indexBytes: Number(r.idx ?? 0) }));
  }

  /** Bytes (data + indexes) per stored point of scan_points. */
  async bytesPerPoint(tables?: TableStorage[]): Promise<number> {
    const points = (tables ?? (await this.tables())).find((t) => t.table === 'scan_points');
    if (!points || points.rows === 0) return 0;
    return (points.dataBytes + points.indexBytes) / points.rows;
  }

  /** Stored points per scan (counted, not estimated) for the given scans. */
  async pointsOf(scanIds: number[]): Promise<Map<number, number>> {
    if (scanIds.length === 0) return new Map();
    const rows: { id: number; n: string }[] = await this.db.query(
      'SELECT scan_id AS id, COUNT(*) AS n FROM scan_points WHERE scan_id IN (?) GROUP BY scan_id', [scanIds],
    );
    return new Map(rows.map((r) => [Number(r.id), Number(r.n)]));
  }

  async report(user: SessionUser, retention: StorageReport['retention']): Promise<StorageReport> {
    const led = await this.maintenanceAccess.ledGroupIds(user);
    if (led && led.length === 0) throw new ForbiddenException('Storage figures are for site admins and group leads');
    const tables = await this.tables();
    const perPoint = await this.bytesPerPoint(tables);
    const inGroups = led ? 'WHERE g.id IN (?)' : '';
    const params = led ? [led] : [];
    const groups: { id: number; name: string; scans: string; points: string | null }[] = await this.db.query(
      `SELECT g.id, g.name, COUNT(s.id) AS scans,
              (SELECT COUNT(*) FROM scan_points p JOIN scans ps ON ps.id = p.scan_id WHERE ps.group_id = g.id) AS points
         FROM \`groups\` g LEFT JOIN scans s ON s.group_id = g.id ${inGroups} GROUP BY g.id, g.name ORDER BY g.name`,
      params,
    );
    const archives: { gid: number; n: string; bytes: string }[] = await this.db.query(
      `SELECT group_id AS gid, COUNT(*) AS n, COALESCE(SUM(bytes), 0) AS bytes FROM scan_archives ${led ? 'WHERE group_id IN (?)' : ''} GROUP BY group_id`,
      params,
    );
    const archivesOf = new Map(archives.map((a) => [Number(a.gid), a]));
    const scans: { id: number; name: string; gid: number; status: StorageReport['scans'][number]['status']; n: string }[] = await this.db.query(
      `SELECT s.id, s.name, s.group_id AS gid, s.status, COUNT(p.point_index) AS n
         FROM scans s LEFT JOIN scan_points p ON p.scan_id = s.id ${led ? 'WHERE s.group_id IN (?)' : ''}
        GROUP BY s.id, s.name, s.group_id, s.status ORDER BY n DESC, s.id DESC LIMIT ${LARGEST_SCANS}`,
      params,
    );
    return {
      tables,
      bytesPerPoint: perPoint,
      groups: groups.map((g) => ({
        groupId: Number(g.id), groupName: g.name, scans: Number(g.scans), points: Number(g.points ?? 0),
        bytes: Math.round(Number(g.points ?? 0) * perPoint),
        archives: Number(archivesOf.get(Number(g.id))?.n ?? 0), archiveBytes: Number(archivesOf.get(Number(g.id))?.bytes ?? 0),
      })),
      scans: scans.map((s) => ({ scanId: Number(s.id), name: s.name, groupId: Number(s.gid), status: s.status, points: Number(s.n), bytes: Math.round(Number(s.n) * perPoint) })),
      retention,
    };
  }
}
