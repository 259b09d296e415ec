import { Body, Controller, Delete, Get, HttpCode, Param, ParseIntPipe, Patch, Post } from '@nestjs/common';
import { ApiOperation, ApiResponse, ApiTags } from '@nestjs/swagger';
import {
  modelInputSchema, modelUpdateSchema, potentialModelSchema, type ModelInput, type ModelUpdate, type PotentialModel,
} from '@sixtyfold/shared';
import { z } from 'zod';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import { ApiErrorResponses, ApiZodBody, ApiZodResponse } from '../openapi/zod-openapi.decorators';
import { ModelsService } from './models.service';

@ApiTags('models')
@Controller('models')
export class ModelsController {
  constructor(private readonly models: ModelsService) {}

  @Get()
  @ApiOperation({ summary: 'Potential models of my groups, by name' })
  @ApiZodResponse(200, z.array(potentialModelSchema), 'The models')
  @ApiErrorResponses(401)
  list(@CurrentUser() user: SessionUser): Promise<PotentialModel[]> {
    return this.models.list(user);
  }

  @Get(':id')
  @ApiOperation({ summary: 'One potential model' })
  @ApiZodResponse(200, potentialModelSchema, 'The model')
  @ApiErrorResponses(400, 401, 404)
  get(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<PotentialModel> {
    return this.models.get(user, id);
  }

  @Post()
  @ApiOperation({ summary: 'Add a potential model to a group (needs the member role in the group)' })
  @ApiZodBody(modelInputSchema, 'V(phi) as an expression in phi and the declared parameters, and where inflation starts')
  @ApiZodResponse(201, potentialModelSchema, 'The stored model')
  @ApiErrorResponses(400, 401, 403, 404, 409)
  create(@CurrentUser() user: SessionUser, @Body(new ZodValidationPipe(modelInputSchema)) input: ModelInput): Promise<PotentialModel> {
    return this.models.create(user, input);
  }

  @Patch(':id')
  @ApiOperation({ summary: "Replace some fields of a model (needs the member role in the model's group); scans already submitted keep the old definition" })
  @ApiZodBody(modelUpdateSchema, 'The fields to replace; the model that results is checked as a whole')
  @ApiZodResponse(200, potentialModelSchema, 'The model as stored now')
  @ApiErrorResponses(400, 401, 403, 404, 409)
  update(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(new ZodValidationPipe(modelUpdateSchema)) changes: ModelUpdate,
  ): Promise<PotentialModel> {
    return this.models.update(user, id, changes);
  }

  @Delete(':id')
  @HttpCode(204)
  @ApiOperation({ summary: 'Delete a model (a lead of its group); its scans keep their results and stay readable' })
  @ApiResponse({ status: 204, description: 'Deleted' })
  @ApiErrorResponses(400, 401, 403, 404)
  remove(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<void> {
    return this.models.remove(user, id);
  }
}
