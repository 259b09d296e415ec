import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { GroupsModule } from '../groups/groups.module';
import { ConstraintRegionsController } from './constraint-regions.controller';
import { ConstraintRegionsService } from './constraint-regions.service';
import { ConstraintRegion } from './entities/constraint-region.entity';

@Module({
  imports: [TypeOrmModule.forFeature([ConstraintRegion]), GroupsModule, AuditModule],
  controllers: [ConstraintRegionsController],
  providers: [ConstraintRegionsService],
  exports: [ConstraintRegionsService],
})
export class ConstraintRegionsModule {}
