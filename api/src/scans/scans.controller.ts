import { Body, Controller, Delete, Get, HttpCode, Param, ParseIntPipe, Post, Query } from '@nestjs/common';
import { createScanSchema, scanListQuerySchema, type CreateScan, type Page, type ScanDetail, type ScanListQuery, type ScanSummary } from '@sixtyfold/shared';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import { ScansService } from './scans.service';

@Controller('scans')
export class ScansController {
  constructor(private readonly scans: ScansService) {}

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

  @Post(':id/cancel')
  @HttpCode(200)
  cancel(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<ScanDetail> {
    return this.scans.cancel(user, id);
  }

  @Delete(':id')
  @HttpCode(204)
  remove(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<void> {
    return this.scans.remove(user, id);
  }
}
