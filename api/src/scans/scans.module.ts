import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { ExportsModule } from '../exports/exports.module';
import { GroupsModule } from '../groups/groups.module';
import { LikelihoodsModule } from '../likelihoods/likelihoods.module';
import { MaintenanceModule } from '../maintenance/maintenance.module';
import { ScanQueueModule } from '../queue/scan-queue.module';
import { SchedulingModule } from '../scheduling/scheduling.module';
import { Scan } from './entities/scan.entity';
import { ScanPoint } from './entities/scan-point.entity';
import { ScanTag } from './entities/scan-tag.entity';
import { ScanConstraintsService } from './scan-constraints.service';
import { ScanQueueService } from './scan-queue.service';
import { ScanReconcilerService } from './scan-reconciler.service';
import { ScanRefinementsController } from './scan-refinements.controller';
import { ScanRefinementsService } from './scan-refinements.service';
import { ScanResultsService } from './scan-results.service';
import { ScansController } from './scans.controller';
import { ScansService } from './scans.service';

@Module({
  imports: [TypeOrmModule.forFeature([Scan, ScanTag, ScanPoint]), GroupsModule, AuditModule, ScanQueueModule.register(), MaintenanceModule, SchedulingModule, ExportsModule, LikelihoodsModule],
  controllers: [ScansController, ScanRefinementsController],
  providers: [ScansService, ScanQueueService, ScanReconcilerService, ScanResultsService, ScanConstraintsService, ScanRefinementsService],
})
export class ScansModule {}
