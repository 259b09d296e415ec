import { Body, Controller, Delete, Get, HttpCode, Param, ParseIntPipe, Post } from '@nestjs/common';
import { ApiOperation, ApiResponse, ApiTags } from '@nestjs/swagger';
import {
  apiTokenListSchema, createApiTokenSchema, createdApiTokenSchema, type ApiToken, type CreateApiToken, type CreatedApiToken,
} from '@sixtyfold/shared';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { SessionOnly } from '../common/decorators/session-only.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import { ApiErrorResponses, ApiZodBody, ApiZodResponse } from '../openapi/zod-openapi.decorators';
import { TokensService } from './tokens.service';

/** Personal API tokens, managed from a browser session only (see SessionOnly). */
@ApiTags('tokens')
@SessionOnly()
@Controller('tokens')
export class TokensController {
  constructor(private readonly tokens: TokensService) {}

  @Get()
  @ApiOperation({ summary: 'My API tokens (never their secrets); revoked tokens are not listed' })
  @ApiZodResponse(200, apiTokenListSchema, 'My tokens, newest first')
  @ApiErrorResponses(401, 403)
  list(@CurrentUser() user: SessionUser): Promise<ApiToken[]> {
    return this.tokens.list(user);
  }

  @Post()
  @ApiOperation({ summary: 'Create an API token; the answer carries its secret, the only time it is shown' })
  @ApiZodBody(createApiTokenSchema)
  @ApiZodResponse(201, createdApiTokenSchema, 'The new token, with `token` (sfy_…) to send as `Authorization: Bearer`')
  @ApiErrorResponses(400, 401, 403)
  create(@CurrentUser() user: SessionUser, @Body(new ZodValidationPipe(createApiTokenSchema)) body: CreateApiToken): Promise<CreatedApiToken> {
    return this.tokens.create(user, body);
  }

  @Delete(':id')
  @HttpCode(204)
  @ApiOperation({ summary: 'Revoke one of my API tokens; it stops working at once' })
  @ApiResponse({ status: 204, description: 'Revoked' })
  @ApiErrorResponses(401, 403, 404)
  revoke(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<void> {
    return this.tokens.revoke(user, id);
  }
}
