import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { Group } from './entities/group.entity';
import { Membership } from './entities/membership.entity';
import { GroupAccessService } from './group-access.service';
import { GroupsController } from './groups.controller';
import { GroupsService } from './groups.service';

@Module({
  imports: [TypeOrmModule.forFeature([Group, Membership]), AuditModule],
  controllers: [GroupsController],
  providers: [GroupsService, GroupAccessService],
  exports: [GroupAccessService],
})
export class GroupsModule {}
