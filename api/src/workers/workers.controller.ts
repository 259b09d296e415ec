import { Controller, Get } from '@nestjs/common';
import type { WorkerHeartbeat } from '@sixtyfold/shared';
import { WorkersService } from './workers.service';

@Controller('workers')
export class WorkersController {
  constructor(private readonly workers: WorkersService) {}

  @Get()
  list(): Promise<WorkerHeartbeat[]> {
    return this.workers.alive();
  }
}
