import { AuditEvent } from '../audit/entities/audit-event.entity';
import { Comment } from '../comments/entities/comment.entity';
import { CommentMention } from '../comments/entities/comment-mention.entity';
import { ConstraintRegion } from '../constraint-regions/entities/constraint-region.entity';
import { Group } from '../groups/entities/group.entity';
import { Invitation } from '../invitations/entities/invitation.entity';
import { StoredLikelihoodSet } from '../likelihoods/entities/likelihood-set.entity';
import { Membership } from '../groups/entities/membership.entity';
import { ScanArchive } from '../maintenance/entities/scan-archive.entity';
import { Notification } from '../notifications/entities/notification.entity';
import { PotentialModel } from '../models/entities/potential-model.entity';
import { Scan } from '../scans/entities/scan.entity';
import { ScanReproduction } from '../reproductions/entities/scan-reproduction.entity';
import { ScanChunkRun } from '../scans/entities/scan-chunk-run.entity';
import { ScanPoint } from '../scans/entities/scan-point.entity';
import { ScanTag } from '../scans/entities/scan-tag.entity';
import { ApiToken } from '../tokens/entities/api-token.entity';
import { User } from '../users/entities/user.entity';

/** Every entity, once: the API, the worker and the migration CLI all load this list. */
export const ENTITIES = [
  User, Group, Membership, PotentialModel, Scan, ScanTag, ScanPoint, Comment, CommentMention, Notification, AuditEvent, ApiToken,
  Invitation, ScanArchive, ConstraintRegion, StoredLikelihoodSet, ScanChunkRun, ScanReproduction,
];

export { axisColumnValues, AXIS_COLUMNS } from '../scans/entities/scan-point.entity';
export {
  ApiToken, AuditEvent, Comment, CommentMention, ConstraintRegion, Group, Invitation, Membership, Notification, PotentialModel, Scan,
  ScanArchive, ScanChunkRun, ScanPoint, ScanReproduction, ScanTag, StoredLikelihoodSet, User,
};
