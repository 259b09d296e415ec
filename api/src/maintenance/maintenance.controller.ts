import { Body, Controller, Get, HttpCode, Param, ParseIntPipe, Patch, Post, Query, Res } from '@nestjs/common';
import { ApiOperation, ApiProduces, ApiResponse, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import {
  archiveListQuerySchema, prunePlanSchema, pruneFilterSchema, pruneRequestSchema, pruneResultSchema, retentionPolicySchema,
  retentionRunSchema, scanArchiveSchema, storageReportSchema, type ArchiveListQuery, type PruneFilter, type PrunePlan,
  type PruneRequest, type PruneResult, type RetentionPolicy, type RetentionRun, type ScanArchive, type StorageReport,
} from '@sixtyfold/shared';
import { z } from 'zod';
import { AdminOnly } from '../common/decorators/admin-only.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import { ExportsService } from '../exports/exports.service';
import type { SessionUser } from '../common/session-user';
import { ApiErrorResponses, ApiZodBody, ApiZodQuery, ApiZodResponse } from '../openapi/zod-openapi.decorators';
import { PruneService } from './prune.service';
import { RetentionService } from './retention.service';
import { ScanArchivesService } from './scan-archives.service';
import { StorageService } from './storage.service';

/** Storage, pruning, archives and retention: site admins everywhere, group leads within their groups. */
@ApiTags('maintenance')
@Controller('maintenance')
export class MaintenanceController {
  constructor(
    private readonly storage: StorageService,
    private readonly prune: PruneService,
    private readonly archives: ScanArchivesService,
    private readonly retention: RetentionService,
    private readonly exports: ExportsService,
  ) {}

  @Get('storage')
  @ApiOperation({
    summary: 'Storage per table, group and scan (admins: every group; leads: the groups they lead)',
    description: "Table figures are MariaDB's own (information_schema.TABLES, InnoDB's estimates). InnoDB reports sizes per table, not per row, so a group's or scan's bytes are its share: its stored points times scan_points' bytes per row.",
  })
  @ApiZodResponse(200, storageReportSchema, 'The figures, the largest scans first, and when retention runs next')
  @ApiErrorResponses(401, 403)
  report(@CurrentUser() user: SessionUser): Promise<StorageReport> {
    return this.storage.report(user, this.retention.schedule());
  }

  @Post('prune/dry-run')
  @HttpCode(200)
  @ApiOperation({ summary: 'List exactly the scans a prune with this filter would delete (queued and running scans never are)' })
  @ApiZodBody(pruneFilterSchema, 'Which scans: a lead must name one of their groups')
  @ApiZodResponse(200, prunePlanSchema, 'The scans, with their points and their share of bytes')
  @ApiErrorResponses(400, 401, 403, 404)
  dryRun(@CurrentUser() user: SessionUser, @Body(new ZodValidationPipe(pruneFilterSchema)) filter: PruneFilter): Promise<PrunePlan> {
    return this.prune.plan(user, filter);
  }

  @Post('prune')
  @HttpCode(200)
  @ApiOperation({ summary: 'Archive, then delete, exactly the scans the dry run listed; 409 and nothing deleted if the selection changed' })
  @ApiZodBody(pruneRequestSchema, 'The dry run\'s filter and the scan ids it listed')
  @ApiZodResponse(200, pruneResultSchema, 'Each deleted scan with its archive')
  @ApiErrorResponses(400, 401, 403, 404, 409)
  run(@CurrentUser() user: SessionUser, @Body(new ZodValidationPipe(pruneRequestSchema)) request: PruneRequest): Promise<PruneResult> {
    return this.prune.prune(user, request);
  }

  @Get('archives')
  @ApiOperation({ summary: 'Archives of deleted scans, newest first (admins: all; leads: their groups)' })
  @ApiZodQuery(archiveListQuerySchema)
  @ApiZodResponse(200, z.array(scanArchiveSchema), 'The archives')
  @ApiErrorResponses(400, 401, 403, 404)
  listArchives(@CurrentUser() user: SessionUser, @Query(new ZodValidationPipe(archiveListQuerySchema)) query: ArchiveListQuery): Promise<ScanArchive[]> {
    return this.archives.list(user, query);
  }

  @Get('archives/:id/download')
  @ApiOperation({ summary: 'Download an archive: a .tar.gz holding scan.json (the record and specification) and points.csv' })
  @ApiProduces('application/gzip')
  @ApiResponse({ status: 200, description: 'The archive file', content: { 'application/gzip': { schema: { type: 'string', format: 'binary' } } } })
  @ApiErrorResponses(400, 401, 403, 404, 429)
  async download(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number, @Res({ passthrough: true }) res: Response): Promise<void> {
    const { archive, openFile } = await this.archives.open(user, id);
    const headers = {
      'Content-Type': 'application/gzip',
      'Content-Length': String(archive.bytes),
      'Content-Disposition': `attachment; filename="${archive.fileName}"`,
      'X-Archive-Sha256': archive.sha256,
    };
    await this.exports.send(user, res, { headers, open: openFile });
  }

  @Get('groups/:id/retention')
  @ApiOperation({ summary: "A group's retention policy (its members may read it)" })
  @ApiZodResponse(200, retentionPolicySchema, 'The policy; keepDays null keeps scans for ever')
  @ApiErrorResponses(400, 401, 404)
  getRetention(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<RetentionPolicy> {
    return this.retention.get(user, id);
  }

  @Patch('groups/:id/retention')
  @ApiOperation({ summary: "Set a group's retention policy (a lead of the group, or an admin)" })
  @ApiZodBody(retentionPolicySchema, 'Finished scans with these statuses are pruned nightly once older than keepDays')
  @ApiZodResponse(200, retentionPolicySchema, 'The stored policy')
  @ApiErrorResponses(400, 401, 403, 404)
  setRetention(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(new ZodValidationPipe(retentionPolicySchema)) policy: RetentionPolicy,
  ): Promise<RetentionPolicy> {
    return this.retention.set(user, id, policy);
  }

  @Post('retention/run')
  @AdminOnly()
  @HttpCode(200)
  @ApiOperation({ summary: 'Apply every group\'s retention policy now, as the nightly job does (site admins)' })
  @ApiZodResponse(200, retentionRunSchema, 'Scans deleted per group with a policy')
  @ApiErrorResponses(401, 403)
  runRetention(): Promise<RetentionRun> {
    return this.retention.applyAll();
  }
}
