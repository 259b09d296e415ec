import { Column, CreateDateColumn, Entity, Index, OneToMany, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { NOTIFICATION_EMAIL_MODES, SITE_ROLES, type NotificationEmailMode, type SiteRole } from '@sixtyfold/shared';
import type { Membership } from '../../groups/entities/membership.entity';

@Entity('users')
export class User {
  @PrimaryGeneratedColumn({ unsigned: true })
  id: number;

  @Index('uq_users_email', { unique: true })
  @Column({ type: 'varchar', length: 254 })
  email: string;

  @Column({ name: 'display_name', type: 'varchar', length: 120 })
  displayName: string;

  /** argon2id hash, never sent to clients. */
  @Column({ name: 'password_hash', type: 'varchar', length: 255, select: false })
  passwordHash: string;

  @Column({ name: 'site_role', type: 'enum', enum: SITE_ROLES, default: 'user' })
  siteRole: SiteRole;

  /** How notifications reach this user by e-mail: each at once, a daily digest, or not at all. */
  @Column({ name: 'notification_email', type: 'enum', enum: NOTIFICATION_EMAIL_MODES, default: 'immediate' })
  notificationEmail: NotificationEmailMode;

  @Column({ name: 'last_login_at', type: 'datetime', precision: 3, nullable: true })
  lastLoginAt: Date | null;

  /** Set while a site admin has disabled the account: no sign-in, no session, no API token works. */
  @Column({ name: 'disabled_at', type: 'datetime', precision: 3, nullable: true })
  disabledAt: Date | null;

  /**
   * Sessions remember the epoch they were made in; raising it ends every older session at its next
   * request (a password change, disabling the account). Never sent to clients.
   */
  @Column({ name: 'session_epoch', type: 'int', unsigned: true, default: 0, select: false })
  sessionEpoch: number;

  @CreateDateColumn({ name: 'created_at', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', onUpdate: 'CURRENT_TIMESTAMP(3)' })
  updatedAt: Date;

  @OneToMany('Membership', (m: Membership) => m.user)
  memberships: Membership[];
}
