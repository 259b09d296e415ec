import { Controller, Get, Query } from '@nestjs/common';
import { auditQuerySchema, type AdminUser, type AuditEvent, type AuditQuery, type Page } from '@sixtyfold/shared';
import { AuditService } from '../audit/audit.service';
import { AdminOnly } from '../common/decorators/admin-only.decorator';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import { UsersService } from '../users/users.service';

/** The maintainer's views across every group. */
@AdminOnly()
@Controller('admin')
export class AdminController {
  constructor(
    private readonly users: UsersService,
    private readonly audit: AuditService,
  ) {}

  @Get('users')
  listUsers(): Promise<AdminUser[]> {
    return this.users.listForAdmin();
  }

  @Get('audit-events')
  listAuditEvents(@Query(new ZodValidationPipe(auditQuerySchema)) query: AuditQuery): Promise<Page<AuditEvent>> {
    return this.audit.list(query);
  }
}
