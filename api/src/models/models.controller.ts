import { Body, Controller, Delete, Get, HttpCode, Param, ParseIntPipe, Patch, Post, Res, UploadedFile, UseInterceptors } from '@nestjs/common';
import { ApiOperation, ApiProduces, ApiResponse, ApiTags } from '@nestjs/swagger';
import {
  MODEL_FILE_MAX_BYTES, modelFileSchema, modelInputSchema, modelUpdateSchema, potentialModelSchema,
  type ModelFile, type ModelInput, type ModelUpdate, type PotentialModel,
} from '@sixtyfold/shared';
import type { Response } from 'express';
import { z } from 'zod';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import { FileUpload } from '../common/uploads/file-upload.interceptor';
import { ApiErrorResponses, ApiZodBody, ApiZodMultipart, ApiZodResponse, openApiSchemaOf } from '../openapi/zod-openapi.decorators';
import { ModelsService } from './models.service';

const modelImportFieldsSchema = z.object({ groupId: z.coerce.number({ error: 'choose the group' }).int().positive('choose the group') });

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

  @Post('import')
  @UseInterceptors(FileUpload('file', 'json', MODEL_FILE_MAX_BYTES))
  @ApiOperation({ summary: 'Add a model to a group from a model file (format sixtyfold.potential); same rules as adding one by hand' })
  @ApiZodMultipart(modelImportFieldsSchema, 'file', 'The group, and the model file as JSON (at most 256 kB)')
  @ApiZodResponse(201, potentialModelSchema, 'The stored model')
  @ApiErrorResponses(400, 401, 403, 404, 409, 413, 415)
  import(
    @CurrentUser() user: SessionUser,
    @Body(new ZodValidationPipe(modelImportFieldsSchema)) fields: { groupId: number },
    @UploadedFile() file: Express.Multer.File | undefined,
  ): Promise<PotentialModel> {
    return this.models.importFile(user, fields.groupId, file);
  }

  @Get(':id/export')
  @ApiOperation({ summary: 'Download a model as a model file (format sixtyfold.potential), to import elsewhere' })
  @ApiProduces('application/json')
  @ApiResponse({ status: 200, description: 'The model file', content: { 'application/json': { schema: openApiSchemaOf(modelFileSchema, 'output') } } })
  @ApiErrorResponses(400, 401, 404)
  async export(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number, @Res({ passthrough: true }) res: Response): Promise<ModelFile> {
    const { file, fileName } = await this.models.exportFile(user, id);
    res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
    return file;
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
