import { Injectable, NotFoundException, UnauthorizedException } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { createHash, randomBytes } from 'node:crypto';
import { IsNull, type DataSource, type Repository } from 'typeorm';
import {
  API_TOKEN_PATTERN, API_TOKEN_PREFIX, type ApiToken as ApiTokenDto, type CreateApiToken, type CreatedApiToken,
} from '@sixtyfold/shared';
import { AuditService } from '../audit/audit.service';
import type { SessionUser } from '../common/session-user';
import { UsersService } from '../users/users.service';
import { ApiToken } from './entities/api-token.entity';

/** `sfy_` and 8 characters: enough to tell tokens apart, far too little to guess the rest (200+ bits). */
const SHOWN_PREFIX_LENGTH = API_TOKEN_PREFIX.length + 8;
/** lastUsedAt is a hint for people, not a log: one write a minute per token is plenty. */
const LAST_USED_RESOLUTION_MS = 60_000;
const DAY_MS = 86_400_000;

/**
 * SHA-256 rather than argon2 (which guards the passwords): a token carries 256 random bits, so
 * its hash cannot be reversed by guessing, and a fast, unsalted hash lets every request find its
 * token with one indexed look-up instead of a deliberately slow verification.
 */
export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

@Injectable()
export class TokensService {
  constructor(
    @InjectRepository(ApiToken) private readonly tokens: Repository<ApiToken>,
    @InjectDataSource() private readonly db: DataSource,
    private readonly users: UsersService,
    private readonly audit: AuditService,
  ) {}

  /** My tokens that still count (revoked ones are gone from the list; expired ones show as such). */
  async list(user: SessionUser): Promise<ApiTokenDto[]> {
    const rows = await this.tokens.find({
      where: { userId: user.id, revokedAt: IsNull() },
      order: { createdAt: 'DESC', id: 'DESC' },
    });
    return rows.map(describe);
  }

  /** Creates a token and answers its secret, the only time it leaves the server. */
  async create(user: SessionUser, body: CreateApiToken): Promise<CreatedApiToken> {
    const token = API_TOKEN_PREFIX + randomBytes(32).toString('base64url');
    const expiresAt = new Date(Date.now() + body.expiresInDays * DAY_MS);
    const saved = await this.db.transaction(async (tx) => {
      const row = await tx.getRepository(ApiToken).save({
        userId: user.id,
        name: body.name,
        tokenHash: hashToken(token),
        prefix: token.slice(0, SHOWN_PREFIX_LENGTH),
        expiresAt,
        readOnly: body.readOnly,
        lastUsedAt: null,
        revokedAt: null,
      });
      await this.audit.record(
        { action: 'token.create', actorId: user.id, targetType: 'api_token', targetId: row.id, details: { name: row.name, prefix: row.prefix, expiresAt: expiresAt.toISOString(), readOnly: row.readOnly } },
        tx,
      );
      return row;
    });
    const row = await this.tokens.findOneByOrFail({ id: saved.id });
    return { ...describe(row), token };
  }

  /** Revokes one of my own tokens; anyone else's (or an already revoked one) is 404. */
  async revoke(user: SessionUser, id: number): Promise<void> {
    await this.db.transaction(async (tx) => {
      const repo = tx.getRepository(ApiToken);
      const row = await repo.findOne({ where: { id, userId: user.id, revokedAt: IsNull() }, lock: { mode: 'pessimistic_write' } });
      if (!row) throw new NotFoundException('No such API token');
      await repo.update({ id }, { revokedAt: new Date() });
      await this.audit.record({ action: 'token.revoke', actorId: user.id, targetType: 'api_token', targetId: id, details: { name: row.name, prefix: row.prefix } }, tx);
    });
  }

  /**
   * The user a bearer token acts as, loaded fresh like a session's user, and whether the token is
   * read-only; or a 401 that says why not. Tokens are found by hash, so a wrong token never
   * touches a real row.
   */
  async authenticate(token: string): Promise<{ user: SessionUser; readOnly: boolean }> {
    if (!API_TOKEN_PATTERN.test(token)) {
      throw new UnauthorizedException(`The bearer token is not a Sixtyfold API token: expected ${API_TOKEN_PREFIX} followed by 43 characters`);
    }
    const row = await this.tokens.findOne({ where: { tokenHash: hashToken(token) } });
    if (!row) throw new UnauthorizedException('Unknown API token: check that it was copied whole, or create a new one');
    if (row.revokedAt) throw new UnauthorizedException('This API token was revoked; create a new one under API tokens');
    const now = new Date();
    if (row.expiresAt <= now) {
      throw new UnauthorizedException(`This API token expired on ${row.expiresAt.toISOString()}; create a new one under API tokens`);
    }
    const caller = await this.users.findCaller(row.userId);
    if (!caller) throw new UnauthorizedException('Unknown API token: its account no longer exists');
    if (caller.disabled) throw new UnauthorizedException('Account disabled: a site administrator has disabled the account this API token acts for');
    if (!row.lastUsedAt || now.getTime() - row.lastUsedAt.getTime() >= LAST_USED_RESOLUTION_MS) {
      await this.tokens.update({ id: row.id }, { lastUsedAt: now });
    }
    return { user: caller.user, readOnly: row.readOnly };
  }
}

function describe(row: ApiToken): ApiTokenDto {
  return {
    id: row.id,
    name: row.name,
    prefix: row.prefix,
    createdAt: row.createdAt.toISOString(),
    lastUsedAt: row.lastUsedAt?.toISOString() ?? null,
    expiresAt: row.expiresAt.toISOString(),
    readOnly: row.readOnly,
  };
}
