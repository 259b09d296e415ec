import { ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import { stringify } from 'csv-stringify';
import { createHash, randomBytes } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { mkdir, rename, rm, stat } from 'node:fs/promises';
import path from 'node:path';
import { Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { createGzip } from 'node:zlib';
import { pack } from 'tar-stream';
import { In, type DataSource, type EntityManager } from 'typeorm';
import type { ArchiveListQuery, ScanArchive as ScanArchiveDto } from '@sixtyfold/shared';
import type { SessionUser } from '../common/session-user';
import type { MaintenanceConfig } from '../config/maintenance.config';
import { openQueryStream, type ExportSource } from '../exports/query-stream';
import { GroupAccessService } from '../groups/group-access.service';
import { Scan } from '../scans/entities/scan.entity';
import { readScanProvenance } from '../scans/scan-provenance';
import { ScanArchive } from './entities/scan-archive.entity';
import { MaintenanceAccessService } from './maintenance-access.service';

/** scan_points columns in the archive's CSV, in this order: every input (as JSON) and every output. */
export const ARCHIVE_POINT_COLUMNS = [
  'point_index', 'inputs', 'status', 'failure_reason', 'ns', 'r', 'alpha_s', 'a_s', 'amplitude_scale', 'n_total', 'n_star',
  'phi_star', 'phi_end', 'energy_scale_gev', 'computed_at',
] as const;

/**
 * Writes one .tar.gz per scan before it is deleted: `scan.json` (the scan's record, its stored
 * specification and its provenance) and `points.csv` (every stored point). The points are streamed from MariaDB to a
 * temporary file first, because a tar header needs the entry's size before its bytes.
 */
@Injectable()
export class ScanArchivesService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly config: ConfigService,
    private readonly access: GroupAccessService,
    private readonly maintenanceAccess: MaintenanceAccessService,
  ) {}

  private get dir(): string {
    return this.config.getOrThrow<MaintenanceConfig>('maintenance').archiveDir;
  }

  /** Archives the scan as it is stored now and records the file; the scan itself is untouched. */
  async write(scanId: number, actorId: number | null, manager: EntityManager = this.db.manager): Promise<ScanArchive> {
    const scan = await manager.getRepository(Scan).findOneOrFail({ where: { id: scanId }, relations: { tags: true } });
    await mkdir(this.dir, { recursive: true });
    const stamp = new Date().toISOString().replace(/[-:]/g, '').replace(/\..*$/, '');
    const fileName = `scan-${scan.id}-${stamp}-${randomBytes(3).toString('hex')}.tar.gz`;
    const target = path.join(this.dir, fileName);
    const csvFile = `${target}.points.csv.part`;
    const partial = `${target}.part`;
    try {
      const points = await this.writePointsCsv(scan.id, csvFile);
      const provenance = await readScanProvenance(manager, scan);
      const record = {
        id: scan.id, name: scan.name, groupId: scan.groupId, ownerId: scan.ownerId, modelId: scan.modelId, family: scan.family,
        method: scan.method, status: scan.status, tags: (scan.tags ?? []).map((t) => t.tag).sort(), note: scan.note,
        totalPoints: scan.totalPoints, donePoints: scan.donePoints, failedPoints: scan.failedPoints, storedPoints: points,
        createdAt: scan.createdAt.toISOString(), startedAt: scan.startedAt?.toISOString() ?? null,
        finishedAt: scan.finishedAt?.toISOString() ?? null, archivedAt: new Date().toISOString(), spec: scan.spec,
        // What computed it (`GET /api/scans/:id/provenance`): the submission record and every chunk run.
        provenance,
      };
      const tar = pack();
      const hash = createHash('sha256');
      const hashing = new Transform({ transform(chunk: Buffer, _enc, done) { hash.update(chunk); done(null, chunk); } });
      const written = pipeline(tar, createGzip(), hashing, createWriteStream(partial));
      tar.entry({ name: 'scan.json' }, `${JSON.stringify(record, null, 2)}\n`);
      const size = (await stat(csvFile)).size;
      await new Promise<void>((resolve, reject) => {
        const entry = tar.entry({ name: 'points.csv', size }, (err) => (err ? reject(err) : resolve()));
        createReadStream(csvFile).on('error', reject).pipe(entry);
      });
      tar.finalize();
      await written;
      await rename(partial, target);
      const bytes = (await stat(target)).size;
      const repo = manager.getRepository(ScanArchive);
      const saved = await repo.save(repo.create({
        scanId: scan.id, scanName: scan.name, groupId: scan.groupId, fileName, bytes, sha256: hash.digest('hex'), points, createdById: actorId,
      }));
      return saved;
    } finally {
      await rm(csvFile, { force: true });
      await rm(partial, { force: true });
    }
  }

  /** Streams the scan's points (in point order, never all in memory) into a CSV file; answers the row count. */
  private async writePointsCsv(scanId: number, file: string): Promise<number> {
    const rows = await openQueryStream(this.db, `SELECT ${ARCHIVE_POINT_COLUMNS.join(', ')} FROM scan_points WHERE scan_id = ? ORDER BY point_index`, [scanId]);
    let count = 0;
    const toRecord = new Transform({
      objectMode: true,
      transform(raw: Record<string, unknown>, _enc, done) {
        count += 1;
        done(null, ARCHIVE_POINT_COLUMNS.map((c) => csvValue(c, raw[c])));
      },
    });
    let completed = false;
    try {
      await pipeline(rows.readable, toRecord, stringify({ header: true, columns: [...ARCHIVE_POINT_COLUMNS] }), createWriteStream(file));
      completed = true;
    } finally {
      await rows.close(completed);
    }
    return count;
  }

  async list(user: SessionUser, query: ArchiveListQuery): Promise<ScanArchiveDto[]> {
    const groups = await this.maintenanceAccess.ledGroupIds(user);
    if (groups && groups.length === 0) throw new ForbiddenException('Archives are for site admins and group leads');
    if (query.groupId) await this.access.require(user, query.groupId, 'lead');
    const where = query.groupId ? { groupId: query.groupId } : groups ? { groupId: In(groups) } : {};
    const rows = await this.db.getRepository(ScanArchive).find({ where, relations: { createdBy: true }, order: { createdAt: 'DESC', id: 'DESC' }, take: 1000 });
    return rows.map(toDto);
  }

  /** The archive's record and its file as a download source, for admins and the group's leads. */
  async open(user: SessionUser, id: number): Promise<{ archive: ScanArchiveDto; openFile: () => Promise<ExportSource> }> {
    const row = await this.db.getRepository(ScanArchive).findOne({ where: { id }, relations: { createdBy: true } });
    if (!row) throw new NotFoundException('No such archive');
    await this.access.require(user, row.groupId, 'lead', 'archive');
    const file = path.join(this.dir, row.fileName);
    const exists = await stat(file).then(() => true, () => false);
    if (!exists) throw new NotFoundException(`The archive file ${row.fileName} is missing from the archive folder`);
    const openFile = async (): Promise<ExportSource> => {
      const readable = createReadStream(file);
      return { readable, close: async () => void readable.destroy() };
    };
    return { archive: toDto(row), openFile };
  }
}

/** Dates as ISO text, JSON inputs as their JSON text, nulls as empty cells; numbers as JavaScript prints them (exact round trip). */
function csvValue(column: string, value: unknown): string | number {
  if (value === null || value === undefined) return '';
  if (value instanceof Date) return value.toISOString();
  if (column === 'inputs') return typeof value === 'string' ? value : JSON.stringify(value);
  return value as string | number;
}

function toDto(a: ScanArchive): ScanArchiveDto {
  return {
    id: a.id, scanId: a.scanId, scanName: a.scanName, groupId: a.groupId, fileName: a.fileName, bytes: a.bytes, sha256: a.sha256,
    points: a.points, createdById: a.createdById, createdByName: a.createdBy?.displayName ?? null, createdAt: a.createdAt.toISOString(),
  };
}
