import { BadRequestException, ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { In, IsNull, type DataSource, type EntityManager } from 'typeorm';
import {
  handleOf, mentionedHandles, type CommentBody, type CommentCounts, type CommentDto, type CommentListQuery, type CommentPerson, type CreateComment,
} from '@sixtyfold/shared';
import { AuditService } from '../audit/audit.service';
import type { SessionUser } from '../common/session-user';
import { GroupAccessService } from '../groups/group-access.service';
import { MailQuotaService } from '../mail/mail-quota.service';
import { NotificationsService } from '../notifications/notifications.service';
import { Scan } from '../scans/entities/scan.entity';
import { User } from '../users/entities/user.entity';
import { Comment } from './entities/comment.entity';
import { CommentMention } from './entities/comment-mention.entity';

const EXCERPT_LENGTH = 160;

/**
 * Discussion of a scan and of its points. Anyone who may read the scan (viewers included) may
 * comment; authors edit and delete their own, leads and site admins may delete any.
 */
@Injectable()
export class CommentsService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly access: GroupAccessService,
    private readonly audit: AuditService,
    private readonly notifications: NotificationsService,
    private readonly mailQuota: MailQuotaService,
  ) {}

  async list(user: SessionUser, scanId: number, query: CommentListQuery): Promise<CommentDto[]> {
    await this.readableScan(user, scanId);
    const rows = await this.db.getRepository(Comment).find({
      where: { scanId, pointIndex: query.pointIndex === undefined ? IsNull() : query.pointIndex },
      relations: { author: true },
      order: { createdAt: 'ASC', id: 'ASC' },
    });
    return this.toDtos(rows);
  }

  async counts(user: SessionUser, scanId: number): Promise<CommentCounts> {
    await this.readableScan(user, scanId);
    const rows: { point_index: number | null; n: string }[] = await this.db.query(
      'SELECT point_index, COUNT(*) AS n FROM comments WHERE scan_id = ? GROUP BY point_index', [scanId],
    );
    const counts: CommentCounts = { scan: 0, points: {} };
    for (const r of rows) {
      if (r.point_index === null) counts.scan = Number(r.n);
      else counts.points[String(r.point_index)] = Number(r.n);
    }
    return counts;
  }

  async create(user: SessionUser, scanId: number, input: CreateComment): Promise<CommentDto> {
    const scan = await this.readableScan(user, scanId);
    if (input.pointIndex !== null && input.pointIndex >= scan.totalPoints) {
      const message = `pointIndex: the scan has ${scan.totalPoints} point(s), numbered from 0`;
      throw new BadRequestException({ message, fieldErrors: { pointIndex: [message] } });
    }
    const id = await this.db.transaction(async (tx) => {
      const saved = await tx.getRepository(Comment).save({ scanId, pointIndex: input.pointIndex, authorId: user.id, body: input.body });
      await this.storeMentions(tx, user, scan, saved, []);
      return saved.id;
    });
    void this.notifications.sendImmediate();
    return this.one(id);
  }

  /** Only the author edits; mentions are resolved again and only newly mentioned people are told. */
  async update(user: SessionUser, id: number, input: CommentBody): Promise<CommentDto> {
    const { comment, scan } = await this.readableComment(user, id);
    if (comment.authorId !== user.id) throw new ForbiddenException('Only its author can edit a comment');
    await this.db.transaction(async (tx) => {
      const before = await tx.getRepository(CommentMention).find({ where: { commentId: id } });
      await tx.getRepository(Comment).update({ id }, { body: input.body });
      await tx.getRepository(CommentMention).delete({ commentId: id });
      await this.storeMentions(tx, user, scan, { ...comment, body: input.body }, before.map((m) => m.userId));
    });
    void this.notifications.sendImmediate();
    return this.one(id);
  }

  async remove(user: SessionUser, id: number): Promise<void> {
    const { comment, scan } = await this.readableComment(user, id);
    if (comment.authorId !== user.id && user.siteRole !== 'admin' && (await this.access.roleIn(user, scan.groupId)) !== 'lead') {
      throw new ForbiddenException('Only its author, a lead of the group or a site admin can delete a comment');
    }
    await this.db.transaction(async (tx) => {
      await tx.getRepository(Comment).delete({ id });
      await this.audit.record({
        action: 'comment.delete', actorId: user.id, groupId: scan.groupId, targetType: 'comment', targetId: id,
        details: { scanId: scan.id, pointIndex: comment.pointIndex, authorId: comment.authorId },
      }, tx);
    });
  }

  /** Resolves `@handle`s against the scan's group, stores them and notifies those not mentioned before (never the author). */
  private async storeMentions(tx: EntityManager, user: SessionUser, scan: Scan, comment: Pick<Comment, 'id' | 'body' | 'pointIndex'>, alreadyMentioned: number[]): Promise<void> {
    const handles = mentionedHandles(comment.body);
    if (!handles.length) return;
    const members: { id: number }[] = await tx.query(
      `SELECT u.id FROM memberships m JOIN users u ON u.id = m.user_id
        WHERE m.group_id = ? AND LOWER(SUBSTRING_INDEX(u.email, '@', 1)) IN (?)`,
      [scan.groupId, handles],
    );
    const ids = members.map((m) => Number(m.id));
    if (!ids.length) return;
    await tx.getRepository(CommentMention).insert(ids.map((userId) => ({ commentId: comment.id, userId })));
    const toTell = ids.filter((uid) => uid !== user.id && !alreadyMentioned.includes(uid));
    if (!toTell.length) return;
    // Every notice may become an e-mail; past the author's hourly limit this throws a 429 and
    // the transaction saves nothing, so the author still has the text and is told why.
    await this.mailQuota.take(user.id, 'mention', toTell.length);
    const excerpt = comment.body.length > EXCERPT_LENGTH ? `${comment.body.slice(0, EXCERPT_LENGTH - 1)}…` : comment.body;
    const onPoint = comment.pointIndex !== null;
    await this.notifications.notify(toTell, 'mentioned', {
      title: `${user.displayName} mentioned you on "${scan.name}"`,
      link: onPoint ? `/scans/${scan.id}/points/${comment.pointIndex}` : `/scans/${scan.id}`,
      scanId: scan.id, scanName: scan.name, pointIndex: comment.pointIndex, groupId: scan.groupId, actorName: user.displayName, excerpt,
    }, `comment-${comment.id}-mention`, tx);
  }

  private async readableScan(user: SessionUser, scanId: number): Promise<Scan> {
    const scan = await this.db.getRepository(Scan).findOneBy({ id: scanId });
    if (!scan) throw new NotFoundException('No such scan');
    await this.access.require(user, scan.groupId, 'viewer', 'scan');
    return scan;
  }

  private async readableComment(user: SessionUser, id: number): Promise<{ comment: Comment; scan: Scan }> {
    const comment = await this.db.getRepository(Comment).findOneBy({ id });
    if (!comment) throw new NotFoundException('No such comment');
    const scan = await this.db.getRepository(Scan).findOneByOrFail({ id: comment.scanId });
    await this.access.require(user, scan.groupId, 'viewer', 'comment');
    return { comment, scan };
  }

  private async one(id: number): Promise<CommentDto> {
    const row = await this.db.getRepository(Comment).findOneOrFail({ where: { id }, relations: { author: true } });
    return (await this.toDtos([row]))[0];
  }

  private async toDtos(rows: Comment[]): Promise<CommentDto[]> {
    const mentions = rows.length
      ? await this.db.getRepository(CommentMention).find({ where: { commentId: In(rows.map((r) => r.id)) }, relations: { user: true } })
      : [];
    return rows.map((c) => ({
      id: c.id,
      scanId: c.scanId,
      pointIndex: c.pointIndex,
      body: c.body,
      author: person(c.author),
      createdAt: c.createdAt.toISOString(),
      updatedAt: c.updatedAt.toISOString(),
      // Both times are set by the same INSERT; only an edit moves updated_at.
      edited: c.updatedAt.getTime() !== c.createdAt.getTime(),
      mentions: mentions.filter((m) => m.commentId === c.id).map((m) => person(m.user)),
    }));
  }
}

function person(u: Pick<User, 'id' | 'displayName' | 'email'>): CommentPerson {
  return { id: u.id, displayName: u.displayName, handle: handleOf(u.email) };
}
