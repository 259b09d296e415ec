import { Body, Controller, Delete, Get, HttpCode, Param, ParseIntPipe, Post, Query, Res } from '@nestjs/common';
import type { Response } from 'express';
import { pipeline } from 'node:stream/promises';
import {
  createScanSchema, scanGridQuerySchema, scanListQuerySchema, scanPointsQuerySchema, type CreateScan, type Page, type ScanDetail,
  type ScanGridQuery, type ScanGridSlice, type ScanListQuery, type ScanPointDto, type ScanPointsQuery, type ScanSummary,
} from '@sixtyfold/shared';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import { ScanResultsService } from './scan-results.service';
import { ScansService } from './scans.service';

@Controller('scans')
export class ScansController {
  constructor(
    private readonly scans: ScansService,
    private readonly results: ScanResultsService,
  ) {}

  @Get()
  list(
    @CurrentUser() user: SessionUser,
    @Query(new ZodValidationPipe(scanListQuerySchema)) query: ScanListQuery,
  ): Promise<Page<ScanSummary>> {
    return this.scans.list(user, query);
  }

  @Post()
  create(@CurrentUser() user: SessionUser, @Body(new ZodValidationPipe(createScanSchema)) spec: CreateScan): Promise<ScanDetail> {
    return this.scans.create(user, spec);
  }

  @Get(':id')
  get(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<ScanDetail> {
    return this.scans.get(user, id);
  }

  /** A page of points as JSON, or with `format=csv|json` every matching point, streamed as a download. */
  @Get(':id/points')
  async points(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Query(new ZodValidationPipe(scanPointsQuerySchema)) query: ScanPointsQuery,
    @Res({ passthrough: true }) res: Response,
  ): Promise<Page<ScanPointDto> | void> {
    if (!query.format) return this.results.page(user, id, query);
    const stream = await this.results.export(user, id, query, query.format);
    res.setHeader('Content-Type', query.format === 'csv' ? 'text/csv; charset=utf-8' : 'application/json; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="scan-${id}-points.${query.format}"`);
    await pipeline(stream, res);
  }

  @Get(':id/grid')
  grid(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Query(new ZodValidationPipe(scanGridQuerySchema)) query: ScanGridQuery,
  ): Promise<ScanGridSlice> {
    return this.results.grid(user, id, query);
  }

  @Post(':id/cancel')
  @HttpCode(200)
  cancel(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<ScanDetail> {
    return this.scans.cancel(user, id);
  }

  @Post(':id/retry')
  @HttpCode(200)
  retry(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<ScanDetail> {
    return this.scans.retryFailed(user, id);
  }

  @Post(':id/clone')
  clone(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<ScanDetail> {
    return this.scans.clone(user, id);
  }

  @Delete(':id')
  @HttpCode(204)
  remove(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<void> {
    return this.scans.remove(user, id);
  }
}
