import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { NOTIFICATION_KINDS, type NotificationKind, type NotificationPayload } from '@sixtyfold/shared';
import { User } from '../../users/entities/user.entity';

/** Something that happened for one user; `eventKey` makes recording the same event twice impossible. */
@Entity('notifications')
@Index('uq_notifications_user_event', ['userId', 'eventKey'], { unique: true })
@Index('ix_notifications_user_created', ['userId', 'createdAt'])
@Index('ix_notifications_unemailed', ['emailedAt', 'userId'])
export class Notification {
  @PrimaryGeneratedColumn({ unsigned: true })
  id: number;

  @Column({ name: 'user_id', type: 'int', unsigned: true })
  userId: number;

  @Column({ type: 'enum', enum: NOTIFICATION_KINDS })
  kind: NotificationKind;

  @Column({ type: 'json' })
  payload: NotificationPayload;

  @Column({ name: 'event_key', type: 'varchar', length: 191 })
  eventKey: string;

  @Column({ name: 'read_at', type: 'datetime', precision: 3, nullable: true })
  readAt: Date | null;

  /** When its e-mail went out, alone or in a digest; also set when the user's preference was 'never'. */
  @Column({ name: 'emailed_at', type: 'datetime', precision: 3, nullable: true })
  emailedAt: Date | null;

  @CreateDateColumn({ name: 'created_at', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user: User;
}
