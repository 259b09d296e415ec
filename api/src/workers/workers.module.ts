import { Module } from '@nestjs/common';
import { QueueModule } from '../queue/queue.module';
import { WorkersController } from './workers.controller';
import { WorkersService } from './workers.service';

@Module({ imports: [QueueModule], controllers: [WorkersController], providers: [WorkersService] })
export class WorkersModule {}
