import { Body, Controller, Delete, Get, HttpCode, Param, ParseIntPipe, Patch, Post, Query } from '@nestjs/common';
import { ApiOperation, ApiResponse, ApiTags } from '@nestjs/swagger';
import { z } from 'zod';
import {
  commentBodySchema, commentCountsSchema, commentListQuerySchema, commentSchema, createCommentSchema,
  type CommentBody, type CommentCounts, type CommentDto, type CommentListQuery, type CreateComment,
} from '@sixtyfold/shared';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import { ApiErrorResponses, ApiZodBody, ApiZodQuery, ApiZodResponse } from '../openapi/zod-openapi.decorators';
import { CommentsService } from './comments.service';

@ApiTags('comments')
@Controller()
export class CommentsController {
  constructor(private readonly comments: CommentsService) {}

  @Get('scans/:scanId/comments')
  @ApiOperation({ summary: "A scan's discussion, oldest first: the whole scan's, or one point's with `pointIndex`" })
  @ApiZodQuery(commentListQuerySchema)
  @ApiZodResponse(200, z.array(commentSchema), 'The comments, each with its author and resolved mentions')
  @ApiErrorResponses(400, 401, 404)
  list(
    @CurrentUser() user: SessionUser,
    @Param('scanId', ParseIntPipe) scanId: number,
    @Query(new ZodValidationPipe(commentListQuerySchema)) query: CommentListQuery,
  ): Promise<CommentDto[]> {
    return this.comments.list(user, scanId, query);
  }

  @Get('scans/:scanId/comments/counts')
  @ApiOperation({ summary: 'How many comments the scan and each of its points have' })
  @ApiZodResponse(200, commentCountsSchema, 'Counts by point index (points without comments are left out)')
  @ApiErrorResponses(400, 401, 404)
  counts(@CurrentUser() user: SessionUser, @Param('scanId', ParseIntPipe) scanId: number): Promise<CommentCounts> {
    return this.comments.counts(user, scanId);
  }

  @Post('scans/:scanId/comments')
  @ApiOperation({ summary: 'Comment on a scan or one of its points (any role that can read it); `@handle` mentions group members' })
  @ApiZodBody(createCommentSchema)
  @ApiZodResponse(201, commentSchema, 'The stored comment')
  @ApiErrorResponses(400, 401, 404, 429)
  create(
    @CurrentUser() user: SessionUser,
    @Param('scanId', ParseIntPipe) scanId: number,
    @Body(new ZodValidationPipe(createCommentSchema)) body: CreateComment,
  ): Promise<CommentDto> {
    return this.comments.create(user, scanId, body);
  }

  @Patch('comments/:id')
  @ApiOperation({ summary: 'Edit my own comment; people it newly mentions are notified' })
  @ApiZodBody(commentBodySchema)
  @ApiZodResponse(200, commentSchema, 'The edited comment')
  @ApiErrorResponses(400, 401, 403, 404, 429)
  update(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number, @Body(new ZodValidationPipe(commentBodySchema)) body: CommentBody): Promise<CommentDto> {
    return this.comments.update(user, id, body);
  }

  @Delete('comments/:id')
  @HttpCode(204)
  @ApiOperation({ summary: 'Delete a comment (its author, a lead of the group, or a site admin)' })
  @ApiResponse({ status: 204, description: 'Deleted' })
  @ApiErrorResponses(401, 403, 404)
  remove(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<void> {
    return this.comments.remove(user, id);
  }
}
