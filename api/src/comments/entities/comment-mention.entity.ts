import { Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { User } from '../../users/entities/user.entity';
import { Comment } from './comment.entity';

/** A group member a comment mentions, resolved from `@handle` when the comment was saved. */
@Entity('comment_mentions')
@Index('ix_comment_mentions_user', ['userId'])
export class CommentMention {
  @PrimaryColumn({ name: 'comment_id', type: 'int', unsigned: true })
  commentId: number;

  @PrimaryColumn({ name: 'user_id', type: 'int', unsigned: true })
  userId: number;

  @ManyToOne(() => Comment, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'comment_id' })
  comment: Comment;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user: User;
}
