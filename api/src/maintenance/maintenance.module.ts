import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { Group } from '../groups/entities/group.entity';
import { Membership } from '../groups/entities/membership.entity';
import { ExportsModule } from '../exports/exports.module';
import { GroupsModule } from '../groups/groups.module';
import { SchedulingModule } from '../scheduling/scheduling.module';
import { ScanArchive } from './entities/scan-archive.entity';
import { MaintenanceAccessService } from './maintenance-access.service';
import { MaintenanceController } from './maintenance.controller';
import { PruneService } from './prune.service';
import { RetentionService } from './retention.service';
import { ScanArchivesService } from './scan-archives.service';
import { ScanDeletionService } from './scan-deletion.service';
import { StorageService } from './storage.service';

@Module({
  imports: [TypeOrmModule.forFeature([ScanArchive, Group, Membership]), GroupsModule, AuditModule, SchedulingModule, ExportsModule],
  controllers: [MaintenanceController],
  providers: [MaintenanceAccessService, ScanArchivesService, ScanDeletionService, StorageService, PruneService, RetentionService],
  exports: [ScanDeletionService],
})
export class MaintenanceModule {}
