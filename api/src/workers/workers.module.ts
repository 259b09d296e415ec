import { Module } from '@nestjs/common';
import { WorkersController } from './workers.controller';
import { WorkersService } from './workers.service';

// The scan queue comes from the global ScanQueueModule (registered by ScansModule).
@Module({ controllers: [WorkersController], providers: [WorkersService] })
export class WorkersModule {}
