import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { ConstraintRegionsModule } from '../constraint-regions/constraint-regions.module';
import { StoredLikelihoodSet } from './entities/likelihood-set.entity';
import { LikelihoodSetsController } from './likelihood-sets.controller';
import { LikelihoodSetsService } from './likelihood-sets.service';
import { LikelihoodsService } from './likelihoods.service';

@Module({
  imports: [TypeOrmModule.forFeature([StoredLikelihoodSet]), AuditModule, ConstraintRegionsModule],
  controllers: [LikelihoodSetsController],
  providers: [LikelihoodSetsService, LikelihoodsService],
  exports: [LikelihoodsService, LikelihoodSetsService],
})
export class LikelihoodsModule {}
