import { BadRequestException, Injectable } from '@nestjs/common';
import {
  judgeByRegions, judgeBySet, likelihoodRefText, REGION_LIKELIHOOD_STATEMENT, RegionLikelihood,
  type JudgedLikelihood, type LikelihoodRef, type LikelihoodSet, type PointJudge,
} from '@sixtyfold/shared';
import type { SessionUser } from '../common/session-user';
import { ConstraintRegionsService } from '../constraint-regions/constraint-regions.service';
import { LikelihoodSetsService } from './likelihood-sets.service';

/** A likelihood named in a query, ready to judge points. */
export interface ResolvedLikelihood {
  /** What an answer says it was judged with. */
  description: JudgedLikelihood;
  /** The set's numbers when it is a set: Δχ² in SQL (sorting, filtering, heatmap slices) needs them. */
  set?: LikelihoodSet;
  judge: PointJudge;
}

const percent = (level: number) => `${Number((level * 100).toPrecision(4))}%`;

/** Turns `likelihood=` (a set, or a group's uploaded regions) into one judge of points. */
@Injectable()
export class LikelihoodsService {
  constructor(
    private readonly sets: LikelihoodSetsService,
    private readonly regions: ConstraintRegionsService,
  ) {}

  /** 404 for an unknown set or an unknown or unreadable region; 400 for regions that do not make a region likelihood. */
  async resolve(user: SessionUser, ref: LikelihoodRef, field = 'likelihood'): Promise<ResolvedLikelihood> {
    if (ref.kind === 'set') {
      const set = await this.sets.find(ref.key, ref.version);
      return { description: { ...set, kind: 'set', ref: `${set.key}@${set.version}` }, set, judge: judgeBySet(set) };
    }
    const regions = await this.regions.readable(user, ref.ids);
    let likelihood: RegionLikelihood;
    try {
      likelihood = new RegionLikelihood(regions);
    } catch (error) {
      if (!(error instanceof RangeError)) throw error;
      const message = `${likelihoodRefText(ref)}: ${error.message}`;
      throw new BadRequestException({ message: `${field}: ${message}`, fieldErrors: { [field]: [message] } });
    }
    const byLevel = [...regions].sort((a, b) => a.confidenceLevel - b.confidenceLevel);
    return {
      description: {
        kind: 'regions',
        ref: likelihoodRefText(ref),
        name: `Uploaded regions: ${byLevel.map((region) => `${region.name} (${percent(region.confidenceLevel)})`).join(', ')}`,
        statement: REGION_LIKELIHOOD_STATEMENT,
        regions: byLevel.map(({ id, name, source, confidenceLevel }) => ({ id, name, source, confidenceLevel })),
      },
      judge: judgeByRegions(likelihood),
    };
  }
}
