import { Controller, Get, Param, ParseIntPipe, Query, Res } from '@nestjs/common';
import { ApiOperation, ApiProduces, ApiResponse, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { scanCitationQuerySchema, scanCitationSchema, type ScanCitation, type ScanCitationQuery } from '@sixtyfold/shared';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import { ApiErrorResponses, ApiZodQuery, openApiSchemaOf } from '../openapi/zod-openapi.decorators';
import { CitationsService } from './citations.service';

@ApiTags('scans')
@Controller('scans')
export class CitationsController {
  constructor(private readonly citations: CitationsService) {}

  @Get(':id/citation')
  @ApiOperation({
    summary: "BibTeX for what a scan's results rest on: Sixtyfold (version and commit), the family's papers, the methods papers, the picked likelihood's sources",
    description: '`likelihood=<key>`, `<key>@<version>` or `regions:<id>,<id>` adds that likelihood\'s sources; `format=bib` answers the .bib file as a download.',
  })
  @ApiZodQuery(scanCitationQuerySchema)
  @ApiProduces('application/json', 'application/x-bibtex')
  @ApiResponse({
    status: 200,
    description: 'The entries\' keys and the BibTeX text; with `format=bib`, the text alone',
    content: { 'application/json': { schema: openApiSchemaOf(scanCitationSchema, 'output') }, 'application/x-bibtex': { schema: { type: 'string' } } },
  })
  @ApiErrorResponses(400, 401, 404)
  async citation(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Query(new ZodValidationPipe(scanCitationQuerySchema)) query: ScanCitationQuery,
    @Res({ passthrough: true }) res: Response,
  ): Promise<ScanCitation | string> {
    const citation = await this.citations.citation(user, id, query);
    if (query.format === 'json') return citation;
    res.setHeader('Content-Type', 'application/x-bibtex; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="scan-${id}.bib"`);
    return citation.bibtex;
  }
}
