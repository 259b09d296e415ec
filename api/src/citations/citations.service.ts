import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { scanCitations, toBibtex, type ScanCitation, type ScanCitationQuery } from '@sixtyfold/shared';
import type { SessionUser } from '../common/session-user';
import { GroupAccessService } from '../groups/group-access.service';
import { LikelihoodsService } from '../likelihoods/likelihoods.service';
import { Scan } from '../scans/entities/scan.entity';

/** The BibTeX of what a scan's results rest on: the software that computed it, the family's papers, the methods', the likelihood's. */
@Injectable()
export class CitationsService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly access: GroupAccessService,
    private readonly likelihoods: LikelihoodsService,
  ) {}

  async citation(user: SessionUser, scanId: number, query: ScanCitationQuery): Promise<ScanCitation> {
    const scan = await this.db.getRepository(Scan).findOneBy({ id: scanId });
    if (!scan) throw new NotFoundException('No such scan');
    await this.access.require(user, scan.groupId, 'viewer', 'scan');
    const picked = query.likelihood && (await this.likelihoods.resolve(user, query.likelihood)).description;
    const recorded = scan.provenance;
    const records = scanCitations({
      family: scan.family,
      method: scan.method,
      pivot: scan.spec.pivot.kind,
      likelihoodSources: picked && picked.kind === 'set' ? picked.sources : [],
      likelihoodRegions: picked && picked.kind === 'regions' ? picked.regions : [],
      build: recorded && { engineVersion: recorded.engineVersion, commit: recorded.commit, node: recorded.node },
      year: scan.createdAt.getUTCFullYear(),
    });
    const bibtex = toBibtex(records);
    return { scanId, keys: [...new Set(records.map((r) => r.key))], bibtex };
  }
}
