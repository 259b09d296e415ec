import { Controller, Get, Param, Query } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  outboxMessageSchema, outboxMessageSummarySchema, outboxQuerySchema, pageOf,
  type OutboxMessage, type OutboxMessageSummary, type OutboxQuery, type Page,
} from '@sixtyfold/shared';
import { AdminOnly } from '../common/decorators/admin-only.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import { ApiErrorResponses, ApiZodResponse } from '../openapi/zod-openapi.decorators';
import { MailOutboxService } from './mail-outbox.service';

/** What the local mail catcher received, so invitations can be followed without a real mail service. */
@ApiTags('admin')
@AdminOnly()
@Controller('admin/outbox')
export class MailOutboxController {
  constructor(private readonly outbox: MailOutboxService) {}

  @Get()
  @ApiOperation({ summary: 'Messages the local mail catcher received, newest first (development and tests only)' })
  @ApiZodResponse(200, pageOf(outboxMessageSummarySchema), 'One page of messages')
  @ApiErrorResponses(401, 403, 404)
  list(@Query(new ZodValidationPipe(outboxQuerySchema)) query: OutboxQuery): Promise<Page<OutboxMessageSummary>> {
    return this.outbox.list(query);
  }

  @Get(':messageId')
  @ApiOperation({ summary: 'One caught message with its text and HTML bodies' })
  @ApiZodResponse(200, outboxMessageSchema, 'The message')
  @ApiErrorResponses(401, 403, 404)
  get(@Param('messageId') messageId: string): Promise<OutboxMessage> {
    return this.outbox.get(messageId);
  }
}
