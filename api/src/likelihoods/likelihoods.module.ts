import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { StoredLikelihoodSet } from './entities/likelihood-set.entity';
import { LikelihoodSetsController } from './likelihood-sets.controller';
import { LikelihoodSetsService } from './likelihood-sets.service';

@Module({
  imports: [TypeOrmModule.forFeature([StoredLikelihoodSet]), AuditModule],
  controllers: [LikelihoodSetsController],
  providers: [LikelihoodSetsService],
  exports: [LikelihoodSetsService],
})
export class LikelihoodsModule {}
