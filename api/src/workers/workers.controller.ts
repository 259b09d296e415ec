import { Controller, Get } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { workerHeartbeatSchema, workerPoolSchema, type WorkerHeartbeat, type WorkerPool } from '@sixtyfold/shared';
import { z } from 'zod';
import { ApiErrorResponses, ApiZodResponse } from '../openapi/zod-openapi.decorators';
import { WorkersService } from './workers.service';

@ApiTags('workers')
@Controller('workers')
export class WorkersController {
  constructor(private readonly workers: WorkersService) {}

  @Get()
  @ApiOperation({ summary: 'Worker processes alive now (their heartbeat has not expired)' })
  @ApiZodResponse(200, z.array(workerHeartbeatSchema), 'The live workers, by id')
  @ApiErrorResponses(401)
  list(): Promise<WorkerHeartbeat[]> {
    return this.workers.alive();
  }

  @Get('pool')
  @ApiOperation({ summary: 'The pool at a glance: live workers and the scan queue’s jobs waiting, active, delayed and failed' })
  @ApiZodResponse(200, workerPoolSchema, 'Workers and queue counts')
  @ApiErrorResponses(401)
  pool(): Promise<WorkerPool> {
    return this.workers.pool();
  }
}
