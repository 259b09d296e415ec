import { Controller, Get, Param, ParseIntPipe } from '@nestjs/common';
import type { PotentialModel } from '@sixtyfold/shared';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import type { SessionUser } from '../common/session-user';
import { ModelsService } from './models.service';

@Controller('models')
export class ModelsController {
  constructor(private readonly models: ModelsService) {}

  @Get()
  list(@CurrentUser() user: SessionUser): Promise<PotentialModel[]> {
    return this.models.list(user);
  }

  @Get(':id')
  get(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number): Promise<PotentialModel> {
    return this.models.get(user, id);
  }
}
