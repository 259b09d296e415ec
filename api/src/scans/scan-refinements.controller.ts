import { Body, Controller, Get, Param, ParseIntPipe, Post, Query } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  refinedPointPageSchema, refineEstimateQueryFieldsSchema, refineEstimateQuerySchema, refinementEstimateSchema, refineScanSchema, scanDetailSchema,
  scanLineageSchema, scanPointsQueryFieldsSchema, scanPointsQuerySchema, type RefinedPointPage, type RefinementEstimate, type RefineScan, type ScanDetail,
  type ScanLineage, type ScanPointsQuery,
} from '@sixtyfold/shared';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import { ApiErrorResponses, ApiZodBody, ApiZodQuery, ApiZodResponse } from '../openapi/zod-openapi.decorators';
import { ScanRefinementsService } from './scan-refinements.service';

@ApiTags('scans')
@Controller('scans')
export class ScanRefinementsController {
  constructor(private readonly refinements: ScanRefinementsService) {}

  @Post(':id/refine')
  @ApiOperation({
    summary: 'Refine a completed grid scan where a boundary crosses it: a linked follow-up scan per level (the member role in its group)',
    description: 'Splits the cells the boundary crosses (a likelihood set\'s 68 or 95 % region, or a level of an output) by a factor per axis, '
      + 'as a follow-up scan of the new nodes; each level, when it completes, is followed by the next from the merged mesh, up to `depth` or until no cell is crossed.',
  })
  @ApiZodBody(refineScanSchema, 'The boundary, a factor per axis (2 to 4, or 1 to keep an axis whole; 2 when not named) and the depth (1 to 4)')
  @ApiZodResponse(201, scanDetailSchema, 'The first level, status `queued`')
  @ApiErrorResponses(400, 401, 403, 404, 409)
  refine(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(new ZodValidationPipe(refineScanSchema)) body: RefineScan,
  ): Promise<ScanDetail> {
    return this.refinements.refine(user, id, body);
  }

  @Get(':id/refine/estimate')
  @ApiOperation({
    summary: 'What a refinement would compute first: the crossed cells, the first level\'s points and their run time at the parent\'s pace',
    description: 'The same fields as the request, in the query string: `boundary=likelihood&likelihood=planck18-bk18&level=95` or `boundary=output&output=ns&value=0.965`, `factor.<axis>=2`, `depth=3`.',
  })
  @ApiZodQuery(refineEstimateQueryFieldsSchema)
  @ApiZodResponse(200, refinementEstimateSchema, 'Cells, crossed cells, points of level 1, and seconds at the parent\'s measured points per second')
  @ApiErrorResponses(400, 401, 404, 409)
  estimate(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Query(new ZodValidationPipe(refineEstimateQuerySchema)) query: RefineScan,
  ): Promise<RefinementEstimate> {
    return this.refinements.estimate(user, id, query);
  }

  @Get(':id/refinement/points')
  @ApiOperation({
    summary: 'Every point of a refined grid and its levels as one table, sorted and filtered like a scan\'s points, each row with its scan and level',
    description: 'The query of `/api/scans/:id/points` without `format`: sort by an output, `deltaChi2` or `input.<axis parameter>` (ties by scan, the parent first, then point index; '
      + '`pointIndex`, the default, orders by level, then point index), filter by `status`, `<output>_min`/`_max`, `input.<axis parameter>_min`/`_max` and `deltaChi2_max`; '
      + '`likelihood=<key>[@<version>]` or `regions:<id>,<id>` adds each point\'s Δχ² and confidence level.',
  })
  @ApiZodQuery(scanPointsQueryFieldsSchema.omit({ format: true }))
  @ApiZodResponse(200, refinedPointPageSchema, 'One page of points, each naming its scan and level (0: the parent grid)')
  @ApiErrorResponses(400, 401, 404, 409)
  points(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Query(new ZodValidationPipe(scanPointsQuerySchema)) query: ScanPointsQuery,
  ): Promise<RefinedPointPage> {
    return this.refinements.points(user, id, query);
  }

  @Get(':id/lineage')
  @ApiOperation({ summary: 'A scan\'s refinement lineage: the grid it refines and its level, or the levels refining it' })
  @ApiZodResponse(200, scanLineageSchema, 'The parent (null on a grid scan), the level, and every level of every chain on the parent')
  @ApiErrorResponses(401, 404)
  lineage(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<ScanLineage> {
    return this.refinements.lineage(user, id);
  }
}
