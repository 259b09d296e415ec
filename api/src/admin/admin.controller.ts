import { Controller, Get, Query } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { z } from 'zod';
import {
  adminUserSchema, auditEventSchema, auditQuerySchema, pageOf,
  type AdminUser, type AuditEvent, type AuditQuery, type Page,
} from '@sixtyfold/shared';
import { AuditService } from '../audit/audit.service';
import { AdminOnly } from '../common/decorators/admin-only.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
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

  @Get('audit-events')
  @ApiOperation({ summary: 'The audit log, newest first, filtered by action, actor, group, target type and dates' })
  @ApiZodQuery(auditQuerySchema)
  @ApiZodResponse(200, pageOf(auditEventSchema), 'One page of audit events')
  @ApiErrorResponses(400, 401, 403)
  listAuditEvents(@Query(new ZodValidationPipe(auditQuerySchema)) query: AuditQuery): Promise<Page<AuditEvent>> {
    return this.audit.list(query);
  }
}
