import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { GroupsModule } from '../groups/groups.module';
import { ReproductionsController } from './reproductions.controller';
import { ReproductionsService } from './reproductions.service';

/** Reproducibility checks of stored scans; the queue comes from ScanQueueModule (global, registered by ScansModule). */
@Module({
  imports: [GroupsModule, AuditModule],
  controllers: [ReproductionsController],
  providers: [ReproductionsService],
})
export class ReproductionsModule {}
