import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { User } from '../../users/entities/user.entity';

/**
 * A personal API token: it acts as its user, with the user's current roles. Only a hash of the
 * secret is stored; revoking keeps the row (for the audit trail) and stamps `revokedAt`.
 */
@Entity('api_tokens')
@Index('ix_api_tokens_user', ['userId'])
export class ApiToken {
  @PrimaryGeneratedColumn({ unsigned: true })
  id: number;

  @Column({ name: 'user_id', type: 'int', unsigned: true })
  userId: number;

  @Column({ type: 'varchar', length: 100 })
  name: string;

  /** SHA-256 of the whole token, hex; the only way a token is found. Never sent to clients. */
  @Index('uq_api_tokens_token_hash', { unique: true })
  @Column({ name: 'token_hash', type: 'char', length: 64, select: false })
  tokenHash: string;

  /** The token's first characters (`sfy_` + 8), shown in lists so people can tell tokens apart. */
  @Column({ type: 'varchar', length: 16 })
  prefix: string;

  @CreateDateColumn({ name: 'created_at', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;

  @Column({ name: 'last_used_at', type: 'datetime', precision: 3, nullable: true })
  lastUsedAt: Date | null;

  /** Every token expires (at most API_TOKEN_MAX_DAYS after its creation). */
  @Column({ name: 'expires_at', type: 'datetime', precision: 3 })
  expiresAt: Date;

  /** A read-only token may only read (READ_ONLY_METHODS); AccessGuard refuses the rest with 403. */
  @Column({ name: 'read_only', type: 'boolean', default: false })
  readOnly: boolean;

  @Column({ name: 'revoked_at', type: 'datetime', precision: 3, nullable: true })
  revokedAt: Date | null;

  @ManyToOne('User', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user: User;
}
