import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { BUILT_IN_LIKELIHOOD_SETS, likelihoodSetSchema, type LikelihoodSetEntry, type LikelihoodSetInput } from '@sixtyfold/shared';
import { AuditService } from '../audit/audit.service';
import type { SessionUser } from '../common/session-user';
import { StoredLikelihoodSet } from './entities/likelihood-set.entity';

const builtIn = (): LikelihoodSetEntry[] => BUILT_IN_LIKELIHOOD_SETS.map((set) => ({ ...set, builtIn: true, addedAt: null }));

function toEntry(row: StoredLikelihoodSet): LikelihoodSetEntry {
  // Read through the shared schema, as every stored set is.
  return { ...likelihoodSetSchema.parse(row.definition), builtIn: false, addedAt: row.createdAt.toISOString() };
}

/**
 * The likelihood sets scans are judged with: the built-in ones (in the shared package, versioned
 * with it) and those an admin added, each version a row of its own that is never edited.
 */
@Injectable()
export class LikelihoodSetsService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly audit: AuditService,
  ) {}

  /** Every set, every version: the built-in ones first, then the added ones by key and version. */
  async list(): Promise<LikelihoodSetEntry[]> {
    const rows = await this.db.getRepository(StoredLikelihoodSet).find({ order: { key: 'ASC', version: 'ASC' } });
    return [...builtIn(), ...rows.map(toEntry)];
  }

  /** One set: the version asked, or its latest. */
  async find(key: string, version?: number): Promise<LikelihoodSetEntry> {
    const versions = (await this.list()).filter((set) => set.key === key);
    if (versions.length === 0) throw new NotFoundException(`No likelihood set '${key}'`);
    if (version === undefined) return versions.reduce((a, b) => (b.version > a.version ? b : a));
    const found = versions.find((set) => set.version === version);
    if (!found) throw new NotFoundException(`Likelihood set '${key}' has versions ${versions.map((s) => s.version).join(', ')}, not ${version}`);
    return found;
  }

  /** An admin adds a set, or the next version of one added before; built-in keys are the package's. */
  async add(admin: SessionUser, input: LikelihoodSetInput): Promise<LikelihoodSetEntry> {
    if (BUILT_IN_LIKELIHOOD_SETS.some((set) => set.key === input.key)) {
      throw new ConflictException({ message: `key: '${input.key}' is a built-in set; add yours under a key of its own`, fieldErrors: { key: [`'${input.key}' is a built-in set; choose another key`] } });
    }
    const id = await this.db.transaction(async (tx) => {
      // The key's rows locked, so two admins adding at once get versions n and n + 1.
      const [last] = (await tx.query('SELECT MAX(version) AS version FROM likelihood_sets WHERE set_key = ? FOR UPDATE', [input.key])) as { version: number | null }[];
      const version = Number(last?.version ?? 0) + 1;
      const definition = likelihoodSetSchema.parse({ ...input, version });
      const saved = await tx.getRepository(StoredLikelihoodSet).save({ key: input.key, version, definition, createdById: admin.id });
      await this.audit.record(
        { action: 'likelihood_set.create', actorId: admin.id, targetType: 'likelihood_set', targetId: saved.id, details: { key: input.key, version, name: input.name } },
        tx,
      );
      return saved.id;
    });
    return toEntry(await this.db.getRepository(StoredLikelihoodSet).findOneByOrFail({ id }));
  }
}
