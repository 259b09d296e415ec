import { Body, Controller, Delete, Get, HttpCode, Param, ParseIntPipe, Post, Query, Res, UploadedFile, UseInterceptors } from '@nestjs/common';
import { ApiOperation, ApiProduces, ApiResponse, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import {
  evidenceComparisonQuerySchema, evidenceComparisonSchema, scanConstraintsQuerySchema, scanConstraintsSchema,
  type EvidenceComparison, type EvidenceComparisonQuery, type ScanConstraints, type ScanConstraintsQuery,
  createScanSchema, pageOf, POINTS_CSV_MAX_BYTES, scanUploadFieldsSchema, type ScanUploadFields, scanDetailSchema, scanGridQueryFieldsSchema, scanGridQuerySchema, scanGridSliceSchema, scanListQuerySchema, scanPlaneQuerySchema,
  scanPlaneSchema, scanPointPageSchema, scanPointSchema, scanPointsQueryFieldsSchema, scanPointsQuerySchema, scanSummarySchema, type CreateScan, type Page, type ScanDetail,
  type ScanGridQuery, type ScanGridSlice, type ScanListQuery, type ScanPlane, type ScanPlaneQuery, type ScanPointDto, type ScanPointPage,
  type ScanPointsQuery, type ScanSummary, scanProvenanceAnswerSchema, type ScanProvenanceAnswer,
} from '@sixtyfold/shared';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import { FileUpload } from '../common/uploads/file-upload.interceptor';
import { ApiErrorResponses, ApiZodBody, ApiZodMultipart, ApiZodQuery, ApiZodResponse, openApiSchemaOf } from '../openapi/zod-openapi.decorators';
import { ScanConstraintsService } from './scan-constraints.service';
import { ScanRefinementsService } from './scan-refinements.service';
import { ScanResultsService } from './scan-results.service';
import { ScansService } from './scans.service';

@ApiTags('scans')
@Controller('scans')
export class ScansController {
  constructor(
    private readonly scans: ScansService,
    private readonly results: ScanResultsService,
    private readonly constraintsOf: ScanConstraintsService,
    private readonly refinements: ScanRefinementsService,
  ) {}

  @Get()
  @ApiOperation({ summary: 'Scans of my groups, filtered and paged, newest first' })
  @ApiZodQuery(scanListQuerySchema)
  @ApiZodResponse(200, pageOf(scanSummarySchema), 'One page of scans')
  @ApiErrorResponses(400, 401)
  list(
    @CurrentUser() user: SessionUser,
    @Query(new ZodValidationPipe(scanListQuerySchema)) query: ScanListQuery,
  ): Promise<Page<ScanSummary>> {
    return this.scans.list(user, query);
  }

  @Post()
  @ApiOperation({ summary: 'Submit a scan: stored, then queued for the workers (needs the member role in the group)' })
  @ApiZodBody(createScanSchema, 'The scan specification; axes run in the order given, the last one fastest')
  @ApiZodResponse(201, scanDetailSchema, 'The stored scan, status `queued`')
  @ApiErrorResponses(400, 401, 403, 404)
  create(@CurrentUser() user: SessionUser, @Body(new ZodValidationPipe(createScanSchema)) spec: CreateScan): Promise<ScanDetail> {
    return this.scans.create(user, spec);
  }

  @Post('upload')
  @UseInterceptors(FileUpload('points', 'csv', POINTS_CSV_MAX_BYTES))
  @ApiOperation({
    summary: 'Submit a scan over the points of a CSV file (needs the member role in the group)',
    description: 'The header names the varied inputs (model parameters, nStar, reheatingW, reheatingEnergyGeV), each row is one point. A refused file is a 400 with the line.',
  })
  @ApiZodMultipart(scanUploadFieldsSchema, 'points', 'The scan settings (`spec`, JSON of the create-scan body without axes) and the points file (CSV, at most 8 MB)')
  @ApiZodResponse(201, scanDetailSchema, 'The stored scan, status `queued`')
  @ApiErrorResponses(400, 401, 403, 404, 413, 415)
  upload(
    @CurrentUser() user: SessionUser,
    @Body(new ZodValidationPipe(scanUploadFieldsSchema)) fields: ScanUploadFields,
    @UploadedFile() file: Express.Multer.File | undefined,
  ): Promise<ScanDetail> {
    return this.scans.createFromUpload(user, fields.spec, file);
  }

  @Get('evidence')
  @ApiOperation({
    summary: 'Model comparison: the evidence of each grid scan under each likelihood set, ln B against a reference scan, ranked, in the words of Kass & Raftery (1995)',
    description: '`ids=3,5,8` (at most 8), `likelihoods=planck18-bk18,pact-lb-bk18` (each `key` or `key@version`, or uploaded regions `regions:<id>,<id>`), `reference` (default the first id). '
      + 'The evidence is the mean likelihood over the prior volume each scan chose, so ln B depends on the axes\' ranges.',
  })
  @ApiZodQuery(evidenceComparisonQuerySchema)
  @ApiZodResponse(200, evidenceComparisonSchema, 'Per set, the scans ranked by ln Z, with ln B against the reference')
  @ApiErrorResponses(400, 401, 404, 409)
  evidence(
    @CurrentUser() user: SessionUser,
    @Query(new ZodValidationPipe(evidenceComparisonQuerySchema)) query: EvidenceComparisonQuery,
  ): Promise<EvidenceComparison> {
    return this.constraintsOf.compareEvidence(user, query);
  }

  @Get(':id')
  @ApiOperation({ summary: 'One scan with its specification and progress' })
  @ApiZodResponse(200, scanDetailSchema, 'The scan; poll `status` and `progress` until it is `completed`')
  @ApiErrorResponses(400, 401, 404)
  get(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<ScanDetail> {
    return this.scans.get(user, id);
  }

  @Get(':id/provenance')
  @ApiOperation({ summary: 'What computed a scan: the submitting build, the integrator settings, the spec hash and the worker of every chunk' })
  @ApiZodResponse(200, scanProvenanceAnswerSchema, '`recorded` null and `runsRecorded` false for a scan stored before provenance was recorded')
  @ApiErrorResponses(400, 401, 404)
  provenance(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<ScanProvenanceAnswer> {
    return this.results.provenance(user, id);
  }

  /** A page of points as JSON, or with `format=csv|json|arrow` every matching point, streamed as a download. */
  @Get(':id/points')
  @ApiOperation({
    summary: 'Points of a scan: a page as JSON, or with `format=csv|json|arrow` every matching point as a download',
    description: 'Sort by `pointIndex`, an output or `input.<axis parameter>`; filter outputs with `<output>_min`/`_max` and axis inputs with `input.<axis parameter>_min`/`_max`. '
      + '`likelihood=<key>[@<version>]` or `regions:<id>,<id>` adds each point\'s Δχ² and confidence level; sorting and filtering by Δχ² need a set.',
  })
  @ApiZodQuery(scanPointsQueryFieldsSchema)
  @ApiProduces('application/json', 'text/csv', 'application/vnd.apache.arrow.stream')
  @ApiResponse({
    status: 200,
    description: 'A page of points; with `format`, a CSV (`#` lines saying what computed the scan, then one row per point: pandas reads it with `comment=\'#\'`), '
      + 'a JSON array of every matching point, or an Apache Arrow IPC stream (the columns of the CSV, in record batches of 65,536 rows; the provenance in the schema metadata). '
      + 'Every download carries `X-Sixtyfold-Provenance` (the submission record) and a `Link` to `/api/scans/:id/provenance`.',
    content: {
      'application/json': { schema: openApiSchemaOf(scanPointPageSchema, 'output') },
      'text/csv': { schema: { type: 'string' } },
      'application/vnd.apache.arrow.stream': { schema: { type: 'string', format: 'binary' } },
    },
  })
  @ApiErrorResponses(400, 401, 404, 429, 503)
  async points(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Query(new ZodValidationPipe(scanPointsQuerySchema)) query: ScanPointsQuery,
    @Res({ passthrough: true }) res: Response,
  ): Promise<ScanPointPage | void> {
    if (!query.format) return this.results.page(user, id, query);
    await this.results.export(user, id, query, query.format, res);
  }

  @Get(':id/points/:pointIndex')
  @ApiOperation({ summary: 'One point of a scan by its index in the grid (last axis fastest)' })
  @ApiZodResponse(200, scanPointSchema, 'The stored point: its inputs, status and outputs')
  @ApiErrorResponses(400, 401, 404)
  point(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Param('pointIndex', ParseIntPipe) pointIndex: number,
  ): Promise<ScanPointDto> {
    return this.results.point(user, id, pointIndex);
  }

  @Get(':id/grid')
  @ApiOperation({
    summary: 'A 2-D slice of a scan over two axes, for a heatmap (`at.<parameter>=<index>` fixes the others)',
    description: 'At most `maxCells` (≤ 512) cells along each axis: a larger slice comes in blocks of points per cell. '
      + '`xFrom`, `xTo`, `yFrom`, `yTo` (axis indices, inclusive) zoom into a window, at full resolution when it fits. '
      + 'A scan over a list of points has no grid: 409 (use `/points` or `/plane`).',
  })
  @ApiZodQuery(scanGridQueryFieldsSchema)
  @ApiZodResponse(200, scanGridSliceSchema, 'At most maxCells cells per axis as row-major columns: mean, min and max of the output per block, OK and failed counts by reason')
  @ApiErrorResponses(400, 401, 404, 409)
  async grid(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Query(new ZodValidationPipe(scanGridQuerySchema)) query: ScanGridQuery,
  ): Promise<ScanGridSlice> {
    return this.refinements.withRefinedCells(user, id, query, await this.results.grid(user, id, query));
  }

  @Get(':id/constraints')
  @ApiOperation({
    summary: 'What the scan allows under a likelihood set: the posterior over its grid, 1-D and 2-D marginals, 68/95 % credible intervals, best fit, evidence',
    description: '`likelihood=<key>` or `<key>@<version>` (see `/api/likelihood-sets`), or `regions:<id>,<id>` (uploaded constraint regions); `prior.<axis>=uniform|log` (default: log for a log-spaced axis); '
      + '`x`, `y`: the pair of the 2-D marginal. Failed and flagged points are left out and counted. `format=csv`: the 1-D marginals as CSV.',
  })
  @ApiZodQuery(scanConstraintsQuerySchema)
  @ApiProduces('application/json', 'text/csv')
  @ApiResponse({
    status: 200,
    description: 'The constraints, naming the set and version judged with; with `format=csv`, rows axis,prior,value,mass,density',
    content: { 'application/json': { schema: openApiSchemaOf(scanConstraintsSchema, 'output') }, 'text/csv': { schema: { type: 'string' } } },
  })
  @ApiErrorResponses(400, 401, 404, 409)
  async constraints(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Query(new ZodValidationPipe(scanConstraintsQuerySchema)) query: ScanConstraintsQuery,
    @Res({ passthrough: true }) res: Response,
  ): Promise<ScanConstraints | string> {
    const constraints = await this.constraintsOf.constraints(user, id, query);
    if (query.format === 'json') return constraints;
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    const { likelihood } = constraints;
    const judgedWith = likelihood.kind === 'set' ? `${likelihood.key}-v${likelihood.version}` : likelihood.ref.replace(/[:,]/g, '-');
    res.setHeader('Content-Disposition', `attachment; filename="scan-${id}-marginals-${judgedWith}.csv"`);
    return ScanConstraintsService.marginalsCsv(constraints);
  }

  @Get(':id/plane')
  @ApiOperation({ summary: 'The OK points of a scan as columns for an n_s–r plot; evenly sampled down to `limit` points' })
  @ApiZodQuery(scanPlaneQuerySchema)
  @ApiZodResponse(200, scanPlaneSchema, 'Aligned arrays, element i of each being one point; `stride` > 1 when sampled')
  @ApiErrorResponses(400, 401, 404)
  plane(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Query(new ZodValidationPipe(scanPlaneQuerySchema)) query: ScanPlaneQuery,
  ): Promise<ScanPlane> {
    return this.results.plane(user, id, query);
  }

  @Post(':id/cancel')
  @HttpCode(200)
  @ApiOperation({ summary: 'Cancel a queued or running scan (its owner, or a lead)' })
  @ApiZodResponse(200, scanDetailSchema, 'The cancelled scan')
  @ApiErrorResponses(401, 403, 404, 409)
  cancel(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<ScanDetail> {
    return this.scans.cancel(user, id);
  }

  @Post(':id/retry')
  @HttpCode(200)
  @ApiOperation({ summary: 'Queue the failed points of a finished scan again' })
  @ApiZodResponse(200, scanDetailSchema, 'The scan, queued again')
  @ApiErrorResponses(401, 403, 404, 409)
  retry(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<ScanDetail> {
    return this.scans.retryFailed(user, id);
  }

  @Post(':id/clone')
  @ApiOperation({ summary: 'Copy a scan into a new draft' })
  @ApiZodResponse(201, scanDetailSchema, 'The new draft')
  @ApiErrorResponses(401, 403, 404)
  clone(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<ScanDetail> {
    return this.scans.clone(user, id);
  }

  @Delete(':id')
  @HttpCode(204)
  @ApiOperation({ summary: 'Delete a scan and its points (a lead of its group)' })
  @ApiResponse({ status: 204, description: 'Deleted' })
  @ApiErrorResponses(401, 403, 404)
  remove(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<void> {
    return this.scans.remove(user, id);
  }
}
