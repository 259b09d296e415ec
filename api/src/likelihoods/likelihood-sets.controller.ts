import { Body, Controller, Get, Param, Post, Query } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { z } from 'zod';
import {
  likelihoodSetEntrySchema, likelihoodSetInputSchema, likelihoodSetQuerySchema, type LikelihoodSetEntry, type LikelihoodSetInput,
} from '@sixtyfold/shared';
import { AdminOnly } from '../common/decorators/admin-only.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import { ApiErrorResponses, ApiZodBody, ApiZodQuery, ApiZodResponse } from '../openapi/zod-openapi.decorators';
import { LikelihoodSetsService } from './likelihood-sets.service';

@ApiTags('likelihood sets')
@Controller('likelihood-sets')
export class LikelihoodSetsController {
  constructor(private readonly sets: LikelihoodSetsService) {}

  @Get()
  @ApiOperation({ summary: 'Every likelihood set, every version: the built-in ones, then those an admin added, each with its sources' })
  @ApiZodResponse(200, z.array(likelihoodSetEntrySchema), 'The sets')
  @ApiErrorResponses(401)
  list(): Promise<LikelihoodSetEntry[]> {
    return this.sets.list();
  }

  @Get(':key')
  @ApiOperation({ summary: 'One likelihood set: its latest version, or the version asked' })
  @ApiZodQuery(likelihoodSetQuerySchema)
  @ApiZodResponse(200, likelihoodSetEntrySchema, 'The set')
  @ApiErrorResponses(400, 401, 404)
  find(@Param('key') key: string, @Query(new ZodValidationPipe(likelihoodSetQuerySchema)) query: { version?: number }): Promise<LikelihoodSetEntry> {
    return this.sets.find(key, query.version);
  }

  @Post()
  @AdminOnly()
  @ApiOperation({ summary: 'Add a likelihood set, or the next version of one added before (site admins; audited)' })
  @ApiZodBody(likelihoodSetInputSchema)
  @ApiZodResponse(201, likelihoodSetEntrySchema, 'The set as stored, with its version')
  @ApiErrorResponses(400, 401, 403, 409)
  add(@CurrentUser() admin: SessionUser, @Body(new ZodValidationPipe(likelihoodSetInputSchema)) input: LikelihoodSetInput): Promise<LikelihoodSetEntry> {
    return this.sets.add(admin, input);
  }
}
