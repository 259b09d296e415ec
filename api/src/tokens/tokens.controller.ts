import { Body, Controller, Delete, Get, HttpCode, Param, ParseIntPipe, Post } from '@nestjs/common';
import { createApiTokenSchema, type ApiToken, type CreateApiToken, type CreatedApiToken } from '@sixtyfold/shared';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { SessionOnly } from '../common/decorators/session-only.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import { TokensService } from './tokens.service';

/** Personal API tokens, managed from a browser session only (see SessionOnly). */
@SessionOnly()
@Controller('tokens')
export class TokensController {
  constructor(private readonly tokens: TokensService) {}

  @Get()
  list(@CurrentUser() user: SessionUser): Promise<ApiToken[]> {
    return this.tokens.list(user);
  }

  @Post()
  create(@CurrentUser() user: SessionUser, @Body(new ZodValidationPipe(createApiTokenSchema)) body: CreateApiToken): Promise<CreatedApiToken> {
    return this.tokens.create(user, body);
  }

  @Delete(':id')
  @HttpCode(204)
  revoke(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<void> {
    return this.tokens.revoke(user, id);
  }
}
