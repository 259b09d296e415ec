import { Module } from '@nestjs/common';
import { GroupsModule } from '../groups/groups.module';
import { LikelihoodsModule } from '../likelihoods/likelihoods.module';
import { CitationsController } from './citations.controller';
import { CitationsService } from './citations.service';

/** A scan's citation block (BibTeX), built from the structured records in shared/src/citations. */
@Module({
  imports: [GroupsModule, LikelihoodsModule],
  controllers: [CitationsController],
  providers: [CitationsService],
})
export class CitationsModule {}
