import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { GroupsModule } from '../groups/groups.module';
import { Scan } from './entities/scan.entity';
import { ScanPoint } from './entities/scan-point.entity';
import { ScanTag } from './entities/scan-tag.entity';
import { ScansController } from './scans.controller';
import { ScansService } from './scans.service';

@Module({
  imports: [TypeOrmModule.forFeature([Scan, ScanTag, ScanPoint]), GroupsModule],
  controllers: [ScansController],
  providers: [ScansService],
})
export class ScansModule {}
