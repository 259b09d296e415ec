import { Body, Controller, Delete, Get, HttpCode, Param, ParseIntPipe, Patch, Post } from '@nestjs/common';
import { ApiOperation, ApiResponse, ApiTags } from '@nestjs/swagger';
import {
  changeMemberRoleSchema, createGroupSchema, groupDetailSchema, groupMemberSchema, groupSummarySchema, updateGroupSchema,
  type ChangeMemberRole, type CreateGroup, type GroupDetail, type GroupMember, type GroupSummary, type UpdateGroup,
} from '@sixtyfold/shared';
import { z } from 'zod';
import { AdminOnly } from '../common/decorators/admin-only.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import { ApiErrorResponses, ApiZodBody, ApiZodResponse } from '../openapi/zod-openapi.decorators';
import { GroupsService } from './groups.service';

@ApiTags('groups')
@Controller('groups')
export class GroupsController {
  constructor(private readonly groups: GroupsService) {}

  @Get()
  @ApiOperation({ summary: 'The groups I belong to (site admins: every group)' })
  @ApiZodResponse(200, z.array(groupSummarySchema), 'Groups by name')
  @ApiErrorResponses(401)
  list(@CurrentUser() user: SessionUser): Promise<GroupSummary[]> {
    return this.groups.list(user);
  }

  @Get(':id')
  @ApiOperation({ summary: 'One group with its members' })
  @ApiZodResponse(200, groupDetailSchema, 'The group')
  @ApiErrorResponses(400, 401, 404)
  get(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<GroupDetail> {
    return this.groups.get(user, id);
  }

  @Post()
  @AdminOnly()
  @ApiOperation({ summary: 'Create a group (site admins); invite its first lead next' })
  @ApiZodBody(createGroupSchema)
  @ApiZodResponse(201, groupDetailSchema, 'The new group, with no members yet')
  @ApiErrorResponses(400, 401, 403, 409)
  create(@CurrentUser() user: SessionUser, @Body(new ZodValidationPipe(createGroupSchema)) body: CreateGroup): Promise<GroupDetail> {
    return this.groups.create(user, body);
  }

  @Patch(':id')
  @AdminOnly()
  @ApiOperation({ summary: "Edit a group's name, description or point limit (site admins)" })
  @ApiZodBody(updateGroupSchema)
  @ApiZodResponse(200, groupDetailSchema, 'The group as saved')
  @ApiErrorResponses(400, 401, 403, 404, 409)
  update(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(new ZodValidationPipe(updateGroupSchema)) body: UpdateGroup,
  ): Promise<GroupDetail> {
    return this.groups.update(user, id, body);
  }

  @Patch(':id/members/:userId')
  @ApiOperation({ summary: "Change a member's role (leads and admins); the last lead cannot be demoted" })
  @ApiZodBody(changeMemberRoleSchema)
  @ApiZodResponse(200, groupMemberSchema, 'The member with the new role')
  @ApiErrorResponses(400, 401, 403, 404, 409)
  changeRole(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Param('userId', ParseIntPipe) userId: number,
    @Body(new ZodValidationPipe(changeMemberRoleSchema)) body: ChangeMemberRole,
  ): Promise<GroupMember> {
    return this.groups.changeRole(user, id, userId, body);
  }

  @Delete(':id/members/:userId')
  @HttpCode(204)
  @ApiOperation({ summary: 'Remove a member (leads and admins), or leave the group (your own user id); the last lead stays' })
  @ApiResponse({ status: 204, description: 'Removed' })
  @ApiErrorResponses(400, 401, 403, 404, 409)
  remove(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number, @Param('userId', ParseIntPipe) userId: number): Promise<void> {
    return this.groups.removeMember(user, id, userId);
  }
}
