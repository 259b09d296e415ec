import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import type request from 'supertest';
import { Like } from 'typeorm';
import { Comment } from '../src/comments/entities/comment.entity';
import { readAppConfig } from '../src/config/app.config';
import { readInvitationConfig } from '../src/config/invitation.config';
import { ConstraintRegion } from '../src/constraint-regions/entities/constraint-region.entity';
import { Group } from '../src/groups/entities/group.entity';
import { Membership } from '../src/groups/entities/membership.entity';
import { Invitation } from '../src/invitations/entities/invitation.entity';
import { signInvitationToken } from '../src/invitations/invitation-token';
import { Notification } from '../src/notifications/entities/notification.entity';
import { PotentialModel } from '../src/models/entities/potential-model.entity';
import { Scan } from '../src/scans/entities/scan.entity';
import { ScanReproduction } from '../src/reproductions/entities/scan-reproduction.entity';
import { ScanPoint } from '../src/scans/entities/scan-point.entity';
import { User } from '../src/users/entities/user.entity';
import { createTestApp, DEMO, type TestApp } from './support/test-app';
import { storedSpec } from './support/stored-spec';

type Role = 'anonymous' | 'admin' | 'lead' | 'member' | 'viewer' | 'outsider';
const ROLES: Role[] = ['anonymous', 'admin', 'lead', 'member', 'viewer', 'outsider'];
// lead/member/viewer belong to Plateau Models; the outsider leads the other group.
const EMAIL: Record<Exclude<Role, 'anonymous'>, string> = {
  admin: DEMO.admin,
  lead: DEMO.plateauLead,
  member: DEMO.plateauMember,
  viewer: DEMO.plateauViewer,
  outsider: DEMO.tensorLead,
};

interface RouteCase {
  method: 'get' | 'post' | 'patch' | 'delete';
  /** Express path as registered, e.g. /api/groups/:id */
  route: string;
  /** The concrete URL to call (ids of Plateau Models objects filled in; a scan of its own per role for changes). */
  url: (role: Role) => string;
  expect: Record<Role, number>;
}

const accessModel = (name: string) => ({
  name, expression: 'm^2 * phi^2 / 2', parameters: [{ name: 'm', defaultValue: 6e-6, description: '' }], phiInit: 16, description: '',
});

const everyoneSignedIn = (status: number) => ({ anonymous: 401, admin: status, lead: status, member: status, viewer: status, outsider: status });
const plateauOnly = { anonymous: 401, admin: 200, lead: 200, member: 200, viewer: 200, outsider: 404 };
const adminOnly = { anonymous: 401, admin: 200, lead: 403, member: 403, viewer: 403, outsider: 403 };
const leadsOnly = (status: number) => ({ anonymous: 401, admin: status, lead: status, member: 403, viewer: 403, outsider: 404 });

describe('every route against every role', () => {
  let t: TestApp;
  const agents = new Map<Role, ReturnType<typeof request.agent>>();
  let plateauId: number;
  let plateauModelId: number;
  let plateauScanId: number;
  let plateauReproductionId: number;
  let editedModelId: number;
  let plateauArchiveId: number;
  const ownScan = new Map<Role, number>();
  const ownModel = new Map<Role, number>();
  const ownToken = new Map<Role, number>();
  const ownInvitation = new Map<Role, number>();
  const removableMember = new Map<Role, number>();
  let accessGroupId: number;
  let viewerInvitationToken: string;
  let plateauViewerId: number;
  let switchedUserId: number;
  const ownComment = new Map<Role, number>();
  let memberNotificationId: number;
  const ownRegion = new Map<Role, number>();

  const table: RouteCase[] = [
    { method: 'get', route: '/api/health', url: () => '/api/health', expect: { ...everyoneSignedIn(200), anonymous: 200 } },
    { method: 'get', route: '/api/auth/me', url: () => '/api/auth/me', expect: everyoneSignedIn(200) },
    { method: 'get', route: '/api/groups', url: () => '/api/groups', expect: everyoneSignedIn(200) },
    { method: 'get', route: '/api/groups/:id', url: () => `/api/groups/${plateauId}`, expect: plateauOnly },
    { method: 'post', route: '/api/groups', url: () => '/api/groups', expect: { ...adminOnly, admin: 201 } },
    { method: 'patch', route: '/api/groups/:id', url: () => `/api/groups/${accessGroupId}`, expect: adminOnly },
    { method: 'get', route: '/api/groups/:id/invitations', url: () => `/api/groups/${plateauId}/invitations`, expect: leadsOnly(200) },
    { method: 'post', route: '/api/groups/:id/invitations', url: () => `/api/groups/${plateauId}/invitations`, expect: leadsOnly(201) },
    { method: 'delete', route: '/api/groups/:id/invitations/:invitationId', url: (role) => `/api/groups/${plateauId}/invitations/${ownInvitation.get(role)}`, expect: leadsOnly(204) },
    // Setting the viewer's role to what it is changes nothing, so every row sees the same state.
    { method: 'patch', route: '/api/groups/:id/members/:userId', url: () => `/api/groups/${plateauId}/members/${plateauViewerId}`, expect: leadsOnly(200) },
    // A throwaway member per role; removing someone else needs the lead role.
    { method: 'delete', route: '/api/groups/:id/members/:userId', url: (role) => `/api/groups/${plateauId}/members/${removableMember.get(role)}`, expect: leadsOnly(204) },
    // The link is public; it shows the invitation to anyone who holds it.
    { method: 'get', route: '/api/invitations/:token', url: () => `/api/invitations/${viewerInvitationToken}`, expect: { ...everyoneSignedIn(200), anonymous: 200 } },
    // The invitation is for the viewer's existing account: only they may accept it; after them (the outsider) the link is used.
    { method: 'post', route: '/api/invitations/:token/accept', url: () => `/api/invitations/${viewerInvitationToken}/accept`, expect: { anonymous: 401, admin: 403, lead: 403, member: 403, viewer: 201, outsider: 410 } },
    { method: 'get', route: '/api/models', url: () => '/api/models', expect: everyoneSignedIn(200) },
    { method: 'get', route: '/api/models/:id', url: () => `/api/models/${plateauModelId}`, expect: plateauOnly },
    { method: 'post', route: '/api/models', url: () => '/api/models', expect: { anonymous: 401, admin: 201, lead: 201, member: 201, viewer: 403, outsider: 404 } },
    { method: 'patch', route: '/api/models/:id', url: () => `/api/models/${editedModelId}`, expect: { anonymous: 401, admin: 200, lead: 200, member: 200, viewer: 403, outsider: 404 } },
    // A model of its own per role, so each allowed deletion has something to delete.
    { method: 'delete', route: '/api/models/:id', url: (role) => `/api/models/${ownModel.get(role)}`, expect: { anonymous: 401, admin: 204, lead: 204, member: 403, viewer: 403, outsider: 404 } },
    { method: 'get', route: '/api/models/:id/export', url: () => `/api/models/${plateauModelId}/export`, expect: plateauOnly },
    // Sent without a file: whoever passes the session check learns the upload is incomplete (uploads.e2e-spec covers roles).
    { method: 'post', route: '/api/models/import', url: () => '/api/models/import', expect: everyoneSignedIn(400) },
    { method: 'get', route: '/api/constraint-regions', url: () => '/api/constraint-regions', expect: everyoneSignedIn(200) },
    { method: 'post', route: '/api/constraint-regions', url: () => '/api/constraint-regions', expect: everyoneSignedIn(400) },
    // A region of its own per role, uploaded by the member: leads and admins delete any, members their own.
    { method: 'delete', route: '/api/constraint-regions/:id', url: (role) => `/api/constraint-regions/${ownRegion.get(role)}`, expect: { anonymous: 401, admin: 204, lead: 204, member: 204, viewer: 403, outsider: 404 } },
    { method: 'get', route: '/api/likelihood-sets', url: () => '/api/likelihood-sets', expect: everyoneSignedIn(200) },
    { method: 'get', route: '/api/likelihood-sets/:key', url: () => '/api/likelihood-sets/planck18-bk18', expect: everyoneSignedIn(200) },
    { method: 'post', route: '/api/likelihood-sets', url: () => '/api/likelihood-sets', expect: { ...adminOnly, admin: 400 } },
    { method: 'get', route: '/api/scans', url: () => '/api/scans', expect: everyoneSignedIn(200) },
    { method: 'get', route: '/api/scans/:id', url: () => `/api/scans/${plateauScanId}`, expect: plateauOnly },
    { method: 'get', route: '/api/scans/:id/points', url: () => `/api/scans/${plateauScanId}/points`, expect: plateauOnly },
    { method: 'get', route: '/api/scans/:id/points/:pointIndex', url: () => `/api/scans/${plateauScanId}/points/0`, expect: plateauOnly },
    { method: 'get', route: '/api/scans/:id/grid', url: () => `/api/scans/${plateauScanId}/grid?x=f&y=nStar`, expect: plateauOnly },
    { method: 'get', route: '/api/scans/:id/plane', url: () => `/api/scans/${plateauScanId}/plane`, expect: plateauOnly },
    { method: 'get', route: '/api/scans/:id/constraints', url: () => `/api/scans/${plateauScanId}/constraints?likelihood=planck18-bk18`, expect: plateauOnly },
    // The access-table draft is not completed: whoever may refine it (or read it, for the estimate) gets 409.
    { method: 'post', route: '/api/scans/:id/refine', url: () => `/api/scans/${plateauScanId}/refine`, expect: { anonymous: 401, admin: 409, lead: 409, member: 409, viewer: 403, outsider: 404 } },
    { method: 'get', route: '/api/scans/:id/refine/estimate', url: () => `/api/scans/${plateauScanId}/refine/estimate?boundary=output&output=ns&value=0.965`, expect: { ...plateauOnly, admin: 409, lead: 409, member: 409, viewer: 409 } },
    { method: 'get', route: '/api/scans/:id/refinement/points', url: () => `/api/scans/${plateauScanId}/refinement/points`, expect: { ...plateauOnly, admin: 409, lead: 409, member: 409, viewer: 409 } },
    { method: 'get', route: '/api/scans/:id/lineage', url: () => `/api/scans/${plateauScanId}/lineage`, expect: plateauOnly },
    // Recomputing the scan's one OK point needs the member role; no worker runs here, so the checks stay queued.
    { method: 'post', route: '/api/scans/:id/reproductions', url: () => `/api/scans/${plateauScanId}/reproductions`, expect: { anonymous: 401, admin: 201, lead: 201, member: 201, viewer: 403, outsider: 404 } },
    { method: 'get', route: '/api/scans/:id/reproductions', url: () => `/api/scans/${plateauScanId}/reproductions`, expect: plateauOnly },
    { method: 'get', route: '/api/scans/:id/reproductions/:reproductionId', url: () => `/api/scans/${plateauScanId}/reproductions/${plateauReproductionId}`, expect: plateauOnly },
    { method: 'get', route: '/api/scans/:id/citation', url: () => `/api/scans/${plateauScanId}/citation?likelihood=planck18-bk18`, expect: plateauOnly },
    { method: 'get', route: '/api/scans/:id/provenance', url: () => `/api/scans/${plateauScanId}/provenance`, expect: plateauOnly },
    { method: 'get', route: '/api/scans/evidence', url: () => `/api/scans/evidence?ids=${plateauScanId}`, expect: plateauOnly },
    { method: 'post', route: '/api/scans', url: () => '/api/scans', expect: { anonymous: 401, admin: 201, lead: 201, member: 201, viewer: 403, outsider: 404 } },
    // Sent without the file: the role is checked first (viewer 403 as for any submission); the others learn the file is missing.
    { method: 'post', route: '/api/scans/upload', url: () => '/api/scans/upload', expect: { anonymous: 401, admin: 400, lead: 400, member: 400, viewer: 403, outsider: 404 } },
    // The member owns these scans: members cancel their own, only leads and admins delete.
    { method: 'post', route: '/api/scans/:id/cancel', url: (role) => `/api/scans/${ownScan.get(role)}/cancel`, expect: { anonymous: 401, admin: 200, lead: 200, member: 200, viewer: 403, outsider: 404 } },
    // The access-table draft has no failed points: whoever may retry gets 409, the rest as usual.
    { method: 'post', route: '/api/scans/:id/retry', url: () => `/api/scans/${plateauScanId}/retry`, expect: { anonymous: 401, admin: 409, lead: 409, member: 409, viewer: 403, outsider: 404 } },
    { method: 'post', route: '/api/scans/:id/clone', url: () => `/api/scans/${plateauScanId}/clone`, expect: { anonymous: 401, admin: 201, lead: 201, member: 201, viewer: 403, outsider: 404 } },
    { method: 'delete', route: '/api/scans/:id', url: (role) => `/api/scans/${ownScan.get(role)}`, expect: { anonymous: 401, admin: 204, lead: 204, member: 403, viewer: 403, outsider: 404 } },
    { method: 'get', route: '/api/workers', url: () => '/api/workers', expect: everyoneSignedIn(200) },
    { method: 'get', route: '/api/workers/pool', url: () => '/api/workers/pool', expect: everyoneSignedIn(200) },
    { method: 'get', route: '/api/admin/users', url: () => '/api/admin/users', expect: adminOnly },
    // A throwaway account: only the admin may disable and re-enable it.
    { method: 'post', route: '/api/admin/users/:id/disable', url: () => `/api/admin/users/${switchedUserId}/disable`, expect: adminOnly },
    { method: 'post', route: '/api/admin/users/:id/enable', url: () => `/api/admin/users/${switchedUserId}/enable`, expect: adminOnly },
    { method: 'get', route: '/api/admin/audit-events', url: () => '/api/admin/audit-events', expect: adminOnly },
    { method: 'get', route: '/api/admin/outbox', url: () => '/api/admin/outbox', expect: adminOnly },
    // No message has this id: the admin gets 404 for it, everyone else is stopped first.
    { method: 'get', route: '/api/admin/outbox/:messageId', url: () => '/api/admin/outbox/1796000000000-000000', expect: { ...adminOnly, admin: 404 } },
    // Any role that reads the scan may comment, viewers included; each role edits and deletes a comment of its own.
    { method: 'get', route: '/api/scans/:scanId/comments', url: () => `/api/scans/${plateauScanId}/comments`, expect: plateauOnly },
    { method: 'get', route: '/api/scans/:scanId/comments/counts', url: () => `/api/scans/${plateauScanId}/comments/counts`, expect: plateauOnly },
    { method: 'post', route: '/api/scans/:scanId/comments', url: () => `/api/scans/${plateauScanId}/comments`, expect: { anonymous: 401, admin: 201, lead: 201, member: 201, viewer: 201, outsider: 404 } },
    { method: 'patch', route: '/api/comments/:id', url: (role) => `/api/comments/${ownComment.get(role)}`, expect: plateauOnly },
    { method: 'delete', route: '/api/comments/:id', url: (role) => `/api/comments/${ownComment.get(role)}`, expect: { anonymous: 401, admin: 204, lead: 204, member: 204, viewer: 204, outsider: 404 } },
    // Notifications and preferences are each user's own.
    { method: 'get', route: '/api/notifications', url: () => '/api/notifications', expect: everyoneSignedIn(200) },
    { method: 'get', route: '/api/notifications/unread-count', url: () => '/api/notifications/unread-count', expect: everyoneSignedIn(200) },
    { method: 'post', route: '/api/notifications/read-all', url: () => '/api/notifications/read-all', expect: everyoneSignedIn(200) },
    // The member's notification: only the member may mark it read, the rest get 404.
    { method: 'post', route: '/api/notifications/:id/read', url: () => `/api/notifications/${memberNotificationId}/read`, expect: { anonymous: 401, admin: 404, lead: 404, member: 200, viewer: 404, outsider: 404 } },
    { method: 'get', route: '/api/auth/me/preferences', url: () => '/api/auth/me/preferences', expect: everyoneSignedIn(200) },
    { method: 'patch', route: '/api/auth/me/preferences', url: () => '/api/auth/me/preferences', expect: everyoneSignedIn(200) },
    { method: 'post', route: '/api/admin/notifications/digest', url: () => '/api/admin/notifications/digest', expect: adminOnly },
    // Maintenance: admins everywhere, leads within their group (the outsider leads Tensor Modes).
    { method: 'get', route: '/api/maintenance/storage', url: () => '/api/maintenance/storage', expect: { anonymous: 401, admin: 200, lead: 200, member: 403, viewer: 403, outsider: 200 } },
    { method: 'post', route: '/api/maintenance/prune/dry-run', url: () => '/api/maintenance/prune/dry-run', expect: { anonymous: 401, admin: 200, lead: 200, member: 403, viewer: 403, outsider: 404 } },
    // A tag no scan has: whoever may prune deletes nothing and gets 200.
    { method: 'post', route: '/api/maintenance/prune', url: () => '/api/maintenance/prune', expect: { anonymous: 401, admin: 200, lead: 200, member: 403, viewer: 403, outsider: 404 } },
    { method: 'get', route: '/api/maintenance/archives', url: () => '/api/maintenance/archives', expect: { anonymous: 401, admin: 200, lead: 200, member: 403, viewer: 403, outsider: 200 } },
    { method: 'get', route: '/api/maintenance/archives/:id/download', url: () => `/api/maintenance/archives/${plateauArchiveId}/download`, expect: { anonymous: 401, admin: 200, lead: 200, member: 403, viewer: 403, outsider: 404 } },
    { method: 'get', route: '/api/maintenance/groups/:id/retention', url: () => `/api/maintenance/groups/${plateauId}/retention`, expect: plateauOnly },
    { method: 'patch', route: '/api/maintenance/groups/:id/retention', url: () => `/api/maintenance/groups/${plateauId}/retention`, expect: { anonymous: 401, admin: 200, lead: 200, member: 403, viewer: 403, outsider: 404 } },
    { method: 'post', route: '/api/maintenance/retention/run', url: () => '/api/maintenance/retention/run', expect: adminOnly },
    // Everyone manages their own tokens; DELETE revokes the caller's own (the member's for anonymous).
    { method: 'get', route: '/api/tokens', url: () => '/api/tokens', expect: everyoneSignedIn(200) },
    { method: 'post', route: '/api/tokens', url: () => '/api/tokens', expect: everyoneSignedIn(201) },
    { method: 'delete', route: '/api/tokens/:id', url: (role) => `/api/tokens/${ownToken.get(role)}`, expect: everyoneSignedIn(204) },
    // A wrong current password, so no one's password changes: every signed-in role gets the 400.
    { method: 'post', route: '/api/auth/password', url: () => '/api/auth/password', expect: everyoneSignedIn(400) },
    // Sign-in is open to all (a wrong password here, so every role gets the same answer).
    { method: 'post', route: '/api/auth/login', url: () => '/api/auth/login', expect: { anonymous: 401, admin: 401, lead: 401, member: 401, viewer: 401, outsider: 401 } },
    // Sign-out runs last: it ends the sessions the rows above used.
    { method: 'post', route: '/api/auth/logout', url: () => '/api/auth/logout', expect: everyoneSignedIn(204) },
  ];

  const bodyFor = (route: string, role: Role): object => {
    if (route === '/api/tokens') return { name: `access table (${role})` };
    if (route === '/api/auth/password') return { currentPassword: 'not the password', newPassword: 'access table passphrase' };
    if (route === '/api/auth/login') return { email: `${role}@nowhere.example`, password: 'wrong password' };
    if (route === '/api/groups') return { name: `access table group (${role})` };
    if (route === '/api/groups/:id') return { description: `edited by the access table (${role})` };
    if (route === '/api/groups/:id/invitations') return { email: `access-table-${role}@halvorsen.example`, role: 'viewer' };
    if (route === '/api/groups/:id/members/:userId') return { role: 'viewer' };
    if (route === '/api/models') return { ...accessModel(`access table (${role})`), groupId: plateauId };
    if (route === '/api/scans/:scanId/comments') return { body: `access table (${role})` };
    if (route === '/api/comments/:id') return { body: `edited by the access table (${role})` };
    if (route === '/api/auth/me/preferences') return { notificationEmail: 'immediate' };
    if (route === '/api/models/:id') return { description: `edited by the access table (${role})` };
    if (route === '/api/maintenance/prune/dry-run') return { groupId: plateauId, tag: 'no-such-tag' };
    if (route === '/api/maintenance/prune') return { groupId: plateauId, tag: 'no-such-tag', scanIds: [] };
    if (route === '/api/scans/:id/refine') return { boundary: { kind: 'output', output: 'ns', value: 0.965 }, depth: 1 };
    if (route === '/api/maintenance/groups/:id/retention') return { keepDays: null, statuses: ['completed'] };
    if (route === '/api/scans/upload') {
      const { axes: _, ...settings } = bodyFor('/api/scans', role) as Record<string, unknown>;
      return { spec: JSON.stringify(settings) };
    }
    if (route === '/api/scans') {
      return {
        groupId: plateauId, name: `access table (${role})`, model: { kind: 'family', family: 'starobinsky' },
        axes: [{ kind: 'list', parameter: 'nStar', values: [55] }], pivot: { kind: 'fixed' }, method: 'slowroll',
      };
    }
    return {};
  };

  beforeAll(async () => {
    t = await createTestApp();
    plateauId = (await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' })).id;
    plateauModelId = (await t.db.getRepository(PotentialModel).findOneByOrFail({ groupId: plateauId })).id;
    const owner = await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauMember });
    const scan = await t.db.getRepository(Scan).save({
      groupId: plateauId, ownerId: owner.id, name: 'access-table draft', method: 'slowroll', status: 'draft',
      spec: storedSpec(plateauId),
      note: '', totalPoints: 4,
    });
    plateauScanId = scan.id;
    // One stored point, so that reading it answers 200 to everyone who may see the scan.
    await t.db.getRepository(ScanPoint).insert({
      scanId: scan.id, pointIndex: 0, inputs: { f: 5, nStar: 50 }, status: 'ok', failureReason: null, ns: 0.96, r: 0.1,
      alphaS: null, As: null, amplitudeScale: null, nTotal: null, nStar: 50, phiStar: null, phiEnd: null, energyScaleGeV: null, computedAt: new Date(),
    });
    plateauReproductionId = (await t.db.getRepository(ScanReproduction).save({ scanId: scan.id, status: 'queued', sampleSize: 1, pointIndices: [0] })).id;
    for (const role of ROLES) {
      const own = await t.db.getRepository(Scan).save({
        groupId: plateauId, ownerId: owner.id, name: `access-table queued (${role})`, method: 'slowroll', status: 'queued',
        spec: storedSpec(plateauId), note: '', totalPoints: 1,
      });
      ownScan.set(role, own.id);
    }
    agents.set('anonymous', t.agent());
    for (const role of ROLES.filter((r) => r !== 'anonymous') as Exclude<Role, 'anonymous'>[]) {
      agents.set(role, await t.signIn(EMAIL[role]));
      const token = await agents.get(role)!.post('/api/tokens').send({ name: `access table, to revoke (${role})` });
      ownToken.set(role, token.body.id);
    }
    ownToken.set('anonymous', ownToken.get('member')!);
    plateauViewerId = (await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauViewer })).id;
    switchedUserId = (await t.db.getRepository(User).save({ email: 'access-table-disable@halvorsen.example', displayName: 'Disabled by the access table', passwordHash: 'never signs in' })).id;
    accessGroupId = (await t.db.getRepository(Group).save({ slug: 'access-table-group', name: 'access table group', description: '' })).id;
    const invitations = t.db.getRepository(Invitation);
    const inAWeek = new Date(Date.now() + 7 * 86_400_000);
    const viewerInvitation = await invitations.save({ groupId: accessGroupId, email: DEMO.plateauViewer, role: 'member', invitedById: null, expiresAt: inAWeek });
    viewerInvitationToken = signInvitationToken(readInvitationConfig().secret ?? readAppConfig().sessionSecret, viewerInvitation.id, viewerInvitation.expiresAt);
    for (const role of ROLES) {
      const invitation = await invitations.save({ groupId: plateauId, email: `access-table-revoke-${role}@halvorsen.example`, role: 'viewer', invitedById: null, expiresAt: inAWeek });
      ownInvitation.set(role, invitation.id);
      const throwaway = await t.db.getRepository(User).save({ email: `access-table-remove-${role}@halvorsen.example`, displayName: `Removable (${role})`, passwordHash: 'never signs in' });
      await t.db.getRepository(Membership).insert({ groupId: plateauId, userId: throwaway.id, role: 'viewer' });
      removableMember.set(role, throwaway.id);
    }
    for (const role of ROLES) {
      const author = await t.db.getRepository(User).findOneByOrFail({ email: role === 'anonymous' ? DEMO.plateauMember : EMAIL[role] });
      // The outsider's comment sits on the Plateau scan too (as if written before they left), so they get 404.
      ownComment.set(role, (await t.db.getRepository(Comment).save({ scanId: plateauScanId, pointIndex: null, authorId: author.id, body: `access table (${role})` })).id);
    }
    memberNotificationId = (await t.db.getRepository(Notification).save({
      userId: owner.id, kind: 'mentioned', payload: { title: 'access table', link: null }, eventKey: `access-table-${Date.now()}`, emailedAt: new Date(),
    })).id;
    // A deleted scan's archive, for the download row.
    const archived = await t.db.getRepository(Scan).save({ groupId: plateauId, ownerId: owner.id, name: 'access-table archived', method: 'slowroll', status: 'completed', spec: storedSpec(plateauId), note: '', totalPoints: 0 });
    await agents.get('admin')!.delete(`/api/scans/${archived.id}`).set('content-type', 'application/json').send('{}');
    plateauArchiveId = (await agents.get('admin')!.get(`/api/maintenance/archives?groupId=${plateauId}`)).body[0].id;
    const models = t.db.getRepository(PotentialModel);
    editedModelId = (await models.save({ ...accessModel('access table, edited'), groupId: plateauId })).id;
    for (const role of ROLES) ownModel.set(role, (await models.save({ ...accessModel(`access table, to delete (${role})`), groupId: plateauId })).id);
    for (const role of ROLES) {
      const region = await t.db.getRepository(ConstraintRegion).save({
        groupId: plateauId, name: `access table (${role})`, source: 'access table', confidenceLevel: 0.95,
        vertices: [{ ns: 0.95, r: 0 }, { ns: 0.97, r: 0 }, { ns: 0.96, r: 0.05 }], createdById: owner.id,
      });
      ownRegion.set(role, region.id);
    }
  });
  afterAll(async () => {
    await t.db.getRepository(Notification).delete({ id: memberNotificationId });
    await t.db.getRepository(Scan).delete({ id: plateauScanId });
    for (const id of ownScan.values()) await t.db.getRepository(Scan).delete({ id });
    await t.db.getRepository(PotentialModel).delete({ name: Like('access table%') });
    await t.db.getRepository(Group).delete({ name: Like('access table group%') });
    await t.db.getRepository(Invitation).delete({ email: Like('access-table-%') });
    await t.db.getRepository(User).delete({ email: Like('access-table-%') });
    await t.db.getRepository(ConstraintRegion).delete({ name: Like('access table%') });
    await t.close();
  });

  // The /api/docs pages are plain Express routes outside Nest's router (openapi.e2e-spec covers them).
  it('covers every route the API registers', () => {
    const registered = [...t.routes].sort();
    expect(registered.length).toBeGreaterThan(5);
    const covered = table.map((c) => `${c.method.toUpperCase()} ${c.route}`).sort();
    expect(covered).toEqual(registered);
  });

  for (const row of table) {
    it(`${row.method.toUpperCase()} ${row.route}`, async () => {
      const got: Record<string, number> = {};
      for (const role of ROLES) {
        const agent = agents.get(role)!;
        const url = row.url(role);
        const res = row.method === 'get'
          ? await agent.get(url)
          : row.method === 'delete'
            ? await agent.delete(url).set('content-type', 'application/json').send('{}')
            : await agent[row.method](url).send(bodyFor(row.route, role));
        got[role] = res.status;
      }
      expect(got).toEqual(row.expect);
    });
  }
});

describe('group isolation', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('lists only the groups, models and scans of my own groups', async () => {
    const tensor = await t.db.getRepository(Group).findOneByOrFail({ slug: 'tensor-modes' });
    const plateau = await t.db.getRepository(Group).findOneByOrFail({ slug: 'plateau-models' });
    const owner = await t.db.getRepository(User).findOneByOrFail({ email: DEMO.plateauMember });
    const scan = await t.db.getRepository(Scan).save({
      groupId: plateau.id, ownerId: owner.id, name: 'isolation draft', method: 'exact', status: 'draft', spec: storedSpec(plateau.id), note: '',
    });
    try {
      const agent = await t.signIn(DEMO.tensorMember);
      const groups = (await agent.get('/api/groups')).body as { id: number; myRole: string }[];
      expect(groups.map((g) => g.id)).toEqual([tensor.id]);
      expect(groups[0].myRole).toBe('member');
      const models = (await agent.get('/api/models')).body as { groupId: number }[];
      expect(models.length).toBeGreaterThan(0);
      expect(models.every((m) => m.groupId === tensor.id)).toBe(true);
      const scans = (await agent.get('/api/scans')).body as { items: { id: number }[] };
      expect(scans.items.map((s) => s.id)).not.toContain(scan.id);

      const plateauModel = await t.db.getRepository(PotentialModel).findOneByOrFail({ groupId: plateau.id });
      for (const url of [`/api/groups/${plateau.id}`, `/api/models/${plateauModel.id}`, `/api/scans/${scan.id}`]) {
        const res = await agent.get(url);
        expect({ url, status: res.status }).toEqual({ url, status: 404 });
      }
      // A member of the owning group sees the same scan.
      const insider = await t.signIn(DEMO.plateauViewer);
      const seen = await insider.get(`/api/scans/${scan.id}`);
      expect(seen.status).toBe(200);
      expect(seen.body).toMatchObject({ id: scan.id, ownerName: 'Lucía Marín', status: 'draft', method: 'exact' });
    } finally {
      await t.db.getRepository(Scan).delete({ id: scan.id });
    }
  });

  it('answers 400, not 500, for malformed ids and paging', async () => {
    const agent = await t.signIn(DEMO.tensorMember);
    const badId = await agent.get('/api/groups/not-a-number');
    expect(badId.status).toBe(400);
    const badPage = await agent.get('/api/scans?page=0&pageSize=9999');
    expect(badPage.status).toBe(400);
    expect(Object.keys(badPage.body.fieldErrors).sort()).toEqual(['page', 'pageSize']);
  });

  it('lets a site admin read every group and the audit trail of sign-ins', async () => {
    const admin = await t.signIn(DEMO.admin);
    const groups = (await admin.get('/api/groups')).body as { slug: string; myRole: string | null }[];
    expect(groups.map((g) => g.slug).sort()).toEqual(['plateau-models', 'tensor-modes']);
    const events = await admin.get('/api/admin/audit-events?action=auth.login&pageSize=5');
    expect(events.status).toBe(200);
    expect(events.body.items.length).toBeGreaterThan(0);
    expect(events.body.items.every((e: { action: string }) => e.action === 'auth.login')).toBe(true);
    const users = (await admin.get('/api/admin/users')).body as { email: string; groupCount: number }[];
    expect(users.find((u) => u.email === DEMO.plateauLead)?.groupCount).toBe(1);
  });
});
