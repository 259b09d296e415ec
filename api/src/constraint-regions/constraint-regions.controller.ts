import { Body, Controller, Delete, Get, HttpCode, Param, ParseIntPipe, Post, Query, UploadedFile, UseInterceptors } from '@nestjs/common';
import { ApiOperation, ApiResponse, ApiTags } from '@nestjs/swagger';
import {
  constraintRegionSchema, constraintRegionUploadSchema, REGION_CSV_MAX_BYTES, type ConstraintRegion, type ConstraintRegionUpload,
} from '@sixtyfold/shared';
import { z } from 'zod';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import { FileUpload } from '../common/uploads/file-upload.interceptor';
import { ApiErrorResponses, ApiZodMultipart, ApiZodQuery, ApiZodResponse } from '../openapi/zod-openapi.decorators';
import { ConstraintRegionsService } from './constraint-regions.service';

const regionListQuerySchema = z.object({ groupId: z.coerce.number().int().positive().optional() });

@ApiTags('constraint-regions')
@Controller('constraint-regions')
export class ConstraintRegionsController {
  constructor(private readonly regions: ConstraintRegionsService) {}

  @Get()
  @ApiOperation({ summary: 'Observational constraint regions of my groups (or of one group), newest first' })
  @ApiZodQuery(regionListQuerySchema)
  @ApiZodResponse(200, z.array(constraintRegionSchema), 'The regions')
  @ApiErrorResponses(400, 401, 404)
  list(@CurrentUser() user: SessionUser, @Query(new ZodValidationPipe(regionListQuerySchema)) query: { groupId?: number }): Promise<ConstraintRegion[]> {
    return this.regions.list(user, query.groupId);
  }

  @Post()
  @UseInterceptors(FileUpload('file', 'csv', REGION_CSV_MAX_BYTES))
  @ApiOperation({ summary: 'Upload a constraint region as CSV with header n_s,r (needs the member role in the group)' })
  @ApiZodMultipart(constraintRegionUploadSchema, 'file', 'The name, source and confidence level, and the CSV file of boundary vertices (at most 1 MB)')
  @ApiZodResponse(201, constraintRegionSchema, 'The stored region')
  @ApiErrorResponses(400, 401, 403, 404, 413, 415)
  async upload(
    @CurrentUser() user: SessionUser,
    @Body(new ZodValidationPipe(constraintRegionUploadSchema)) fields: ConstraintRegionUpload,
    @UploadedFile() file: Express.Multer.File | undefined,
  ): Promise<ConstraintRegion> {
    return this.regions.create(user, fields, file);
  }

  @Delete(':id')
  @HttpCode(204)
  @ApiOperation({ summary: 'Delete a region (a lead of its group, or the member who uploaded it)' })
  @ApiResponse({ status: 204, description: 'Deleted' })
  @ApiErrorResponses(400, 401, 403, 404)
  remove(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<void> {
    return this.regions.remove(user, id);
  }
}
