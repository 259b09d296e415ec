import { Body, Controller, Get, Param, ParseIntPipe, Post } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { createReproductionSchema, reproductionListSchema, reproductionSchema, type CreateReproduction, type Reproduction, type ReproductionList } from '@sixtyfold/shared';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import { ApiErrorResponses, ApiZodBody, ApiZodResponse } from '../openapi/zod-openapi.decorators';
import { ReproductionsService } from './reproductions.service';

@ApiTags('scans')
@Controller('scans')
export class ReproductionsController {
  constructor(private readonly reproductions: ReproductionsService) {}

  @Post(':id/reproductions')
  @ApiOperation({ summary: "Check reproducibility: recompute a random sample of the scan's OK points on today's engine (needs the member role)" })
  @ApiZodBody(createReproductionSchema, '`sampleSize` points (default 20, at most 1000; all OK points when the scan has fewer)')
  @ApiZodResponse(201, reproductionSchema, 'The check, `queued`; poll it until `completed`')
  @ApiErrorResponses(400, 401, 403, 404, 409)
  create(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(new ZodValidationPipe(createReproductionSchema)) body: CreateReproduction,
  ): Promise<Reproduction> {
    return this.reproductions.create(user, id, body);
  }

  @Get(':id/reproductions')
  @ApiOperation({ summary: "A scan's reproducibility checks, newest first, with today's build beside the scan's" })
  @ApiZodResponse(200, reproductionListSchema, 'Today’s build, the scan’s build (null when not recorded) and the latest 20 checks')
  @ApiErrorResponses(400, 401, 404)
  list(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<ReproductionList> {
    return this.reproductions.list(user, id);
  }

  @Get(':id/reproductions/:reproductionId')
  @ApiOperation({ summary: 'One reproducibility check: per output identical, or the largest relative difference and its point' })
  @ApiZodResponse(200, reproductionSchema, 'The check; `report` once `completed`')
  @ApiErrorResponses(400, 401, 404)
  one(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Param('reproductionId', ParseIntPipe) reproductionId: number,
  ): Promise<Reproduction> {
    return this.reproductions.one(user, id, reproductionId);
  }
}
