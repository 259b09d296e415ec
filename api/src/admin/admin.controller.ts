import { Controller, Get, HttpCode, Param, ParseIntPipe, Post, Query } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { z } from 'zod';
import {
  adminUserSchema, auditEventSchema, auditQuerySchema, pageOf,
  type AdminUser, type AuditEvent, type AuditQuery, type Page,
} from '@sixtyfold/shared';
import { AuditService } from '../audit/audit.service';
import { AdminOnly } from '../common/decorators/admin-only.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import type { SessionUser } from '../common/session-user';
import { ApiErrorResponses, ApiZodQuery, ApiZodResponse } from '../openapi/zod-openapi.decorators';
import { UsersService } from '../users/users.service';

/** The maintainer's views across every group. */
@ApiTags('admin')
@AdminOnly()
@Controller('admin')
export class AdminController {
  constructor(
    private readonly users: UsersService,
    private readonly audit: AuditService,
  ) {}

  @Get('users')
  @ApiOperation({ summary: 'Every account, with its site role, number of groups and last sign-in' })
  @ApiZodResponse(200, z.array(adminUserSchema), 'The accounts')
  @ApiErrorResponses(401, 403)
  listUsers(): Promise<AdminUser[]> {
    return this.users.listForAdmin();
  }

  @Post('users/:id/disable')
  @HttpCode(200)
  @ApiOperation({ summary: 'Disable an account: its sessions end at once, its API tokens and sign-in are refused (not your own)' })
  @ApiZodResponse(200, adminUserSchema, 'The account, now disabled')
  @ApiErrorResponses(400, 401, 403, 404, 409)
  disableUser(@CurrentUser() admin: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<AdminUser> {
    return this.users.setDisabled(admin, id, true);
  }

  @Post('users/:id/enable')
  @HttpCode(200)
  @ApiOperation({ summary: 'Re-enable a disabled account: it may sign in and use its API tokens again' })
  @ApiZodResponse(200, adminUserSchema, 'The account, now active')
  @ApiErrorResponses(400, 401, 403, 404)
  enableUser(@CurrentUser() admin: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<AdminUser> {
    return this.users.setDisabled(admin, id, false);
  }

  @Get('audit-events')
  @ApiOperation({ summary: 'The audit log, newest first, filtered by action, actor, group, target type and dates' })
  @ApiZodQuery(auditQuerySchema)
  @ApiZodResponse(200, pageOf(auditEventSchema), 'One page of audit events')
  @ApiErrorResponses(400, 401, 403)
  listAuditEvents(@Query(new ZodValidationPipe(auditQuerySchema)) query: AuditQuery): Promise<Page<AuditEvent>> {
    return this.audit.list(query);
  }
}
