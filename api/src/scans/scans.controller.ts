import { Body, Controller, Get, Param, ParseIntPipe, Post, Query } from '@nestjs/common';
import { createScanSchema, pageQuerySchema, type CreateScan, type Page, type PageQuery, type ScanSummary } from '@sixtyfold/shared';
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
    @Query(new ZodValidationPipe(pageQuerySchema)) query: PageQuery,
  ): Promise<Page<ScanSummary>> {
    return this.scans.list(user, query);
  }

  @Post()
  create(@CurrentUser() user: SessionUser, @Body(new ZodValidationPipe(createScanSchema)) spec: CreateScan): Promise<ScanSummary> {
    return this.scans.create(user, spec);
  }

  @Get(':id')
  get(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<ScanSummary> {
    return this.scans.get(user, id);
  }
}
