import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { GroupsModule } from '../groups/groups.module';
import { PotentialModel } from './entities/potential-model.entity';
import { ModelsController } from './models.controller';
import { ModelsService } from './models.service';

@Module({
  imports: [TypeOrmModule.forFeature([PotentialModel]), GroupsModule, AuditModule],
  controllers: [ModelsController],
  providers: [ModelsService],
})
export class ModelsModule {}
