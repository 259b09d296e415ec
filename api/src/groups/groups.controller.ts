import { Controller, Get, Param, ParseIntPipe } from '@nestjs/common';
import type { GroupDetail, GroupSummary } from '@sixtyfold/shared';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import type { SessionUser } from '../common/session-user';
import { GroupsService } from './groups.service';

@Controller('groups')
export class GroupsController {
  constructor(private readonly groups: GroupsService) {}

  @Get()
  list(@CurrentUser() user: SessionUser): Promise<GroupSummary[]> {
    return this.groups.list(user);
  }

  @Get(':id')
  get(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<GroupDetail> {
    return this.groups.get(user, id);
  }
}
