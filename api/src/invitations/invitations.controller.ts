import { Body, Controller, Delete, Get, HttpCode, Param, ParseIntPipe, Post, Req } from '@nestjs/common';
import type { Request } from 'express';
import { ApiOperation, ApiResponse, ApiTags } from '@nestjs/swagger';
import {
  acceptInvitationSchema, createInvitationSchema, currentUserSchema, invitationListSchema, invitationPreviewSchema, invitationSchema,
  type AcceptInvitation, type CreateInvitation, type CurrentUser as CurrentUserDto, type Invitation, type InvitationPreview,
} from '@sixtyfold/shared';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Public } from '../common/decorators/public.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import { ApiErrorResponses, ApiZodBody, ApiZodResponse } from '../openapi/zod-openapi.decorators';
import { UsersService } from '../users/users.service';
import { InvitationsService } from './invitations.service';

/** A group's invitations, managed by its leads and the site admins. */
@ApiTags('groups')
@Controller('groups/:id/invitations')
export class GroupInvitationsController {
  constructor(private readonly invitations: InvitationsService) {}

  @Get()
  @ApiOperation({ summary: 'Pending invitations of the group (leads and admins)' })
  @ApiZodResponse(200, invitationListSchema, 'Pending invitations, newest first')
  @ApiErrorResponses(401, 403, 404)
  list(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) groupId: number): Promise<Invitation[]> {
    return this.invitations.listPending(user, groupId);
  }

  @Post()
  @ApiOperation({ summary: 'Invite an e-mail address with a role; sends the invitation e-mail (replaces a pending one to the same address)' })
  @ApiZodBody(createInvitationSchema)
  @ApiZodResponse(201, invitationSchema, 'The invitation, sent')
  @ApiErrorResponses(400, 401, 403, 404, 409, 429, 502)
  create(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) groupId: number,
    @Body(new ZodValidationPipe(createInvitationSchema)) body: CreateInvitation,
  ): Promise<Invitation> {
    return this.invitations.invite(user, groupId, body);
  }

  @Delete(':invitationId')
  @HttpCode(204)
  @ApiOperation({ summary: 'Revoke a pending invitation; its link stops working' })
  @ApiResponse({ status: 204, description: 'Revoked' })
  @ApiErrorResponses(401, 403, 404, 409)
  revoke(
    @CurrentUser() user: SessionUser,
    @Param('id', ParseIntPipe) groupId: number,
    @Param('invitationId', ParseIntPipe) invitationId: number,
  ): Promise<void> {
    return this.invitations.revoke(user, groupId, invitationId);
  }
}

/** The invitation link's own routes, open to people who have no account yet. */
@ApiTags('invitations')
@Controller('invitations')
export class InvitationLinksController {
  constructor(
    private readonly invitations: InvitationsService,
    private readonly users: UsersService,
  ) {}

  @Public()
  @Get(':token')
  @ApiOperation({ summary: 'What an invitation link offers: group, role, address, inviter, expiry, and whether the address has an account' })
  @ApiZodResponse(200, invitationPreviewSchema, 'The invitation')
  @ApiErrorResponses(404, 410)
  preview(@Param('token') token: string): Promise<InvitationPreview> {
    return this.invitations.preview(token);
  }

  @Public()
  @Post(':token/accept')
  @ApiOperation({
    summary: 'Accept an invitation: a new address sends displayName and password and is signed in; an existing account must be signed in as the invited address',
  })
  @ApiZodBody(acceptInvitationSchema)
  @ApiZodResponse(201, currentUserSchema, 'Joined; the answer is the signed-in user with their memberships')
  @ApiErrorResponses(400, 401, 403, 404, 409, 410)
  async accept(
    @Req() req: Request,
    @Param('token') token: string,
    @Body(new ZodValidationPipe(acceptInvitationSchema)) body: AcceptInvitation,
  ): Promise<CurrentUserDto> {
    const caller = req.isAuthenticated?.() ? req.user : undefined;
    const accepted = await this.invitations.accept(token, caller, body);
    if (accepted.created) {
      // passport regenerates the session id here, as at sign-in.
      await new Promise<void>((resolve, reject) => req.login(accepted.user, (err) => (err ? reject(err) : resolve())));
    }
    return this.users.describe(accepted.user);
  }
}
