import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { Scan } from '../../scans/entities/scan.entity';
import { User } from '../../users/entities/user.entity';

/** A comment on a scan, or on one of its points when `pointIndex` is set. */
@Entity('comments')
@Index('ix_comments_scan_point', ['scanId', 'pointIndex', 'createdAt'])
export class Comment {
  @PrimaryGeneratedColumn({ unsigned: true })
  id: number;

  @Column({ name: 'scan_id', type: 'int', unsigned: true })
  scanId: number;

  @Column({ name: 'point_index', type: 'int', unsigned: true, nullable: true })
  pointIndex: number | null;

  @Column({ name: 'author_id', type: 'int', unsigned: true })
  authorId: number;

  /** Plain text; rendered as text, never as HTML. */
  @Column({ type: 'text' })
  body: string;

  @CreateDateColumn({ name: 'created_at', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', onUpdate: 'CURRENT_TIMESTAMP(3)' })
  updatedAt: Date;

  @ManyToOne(() => Scan, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'scan_id' })
  scan: Scan;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'author_id' })
  author: User;
}
