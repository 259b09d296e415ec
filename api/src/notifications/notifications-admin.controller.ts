import { Controller, HttpCode, Post } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { digestRunSchema, type DigestRun } from '@sixtyfold/shared';
import { AdminOnly } from '../common/decorators/admin-only.decorator';
import { ApiErrorResponses, ApiZodResponse } from '../openapi/zod-openapi.decorators';
import { NotificationsService } from './notifications.service';

@ApiTags('admin')
@AdminOnly()
@Controller('admin/notifications')
export class NotificationsAdminController {
  constructor(private readonly notifications: NotificationsService) {}

  @Post('digest')
  @HttpCode(200)
  @ApiOperation({ summary: 'Send the daily digests now (the same job the morning schedule runs)' })
  @ApiZodResponse(200, digestRunSchema, 'How many digests went out, with how many notifications')
  @ApiErrorResponses(401, 403)
  digest(): Promise<DigestRun> {
    return this.notifications.sendDigests();
  }
}
