import { z } from 'zod';
import { siteRoleSchema } from './roles.schema.js';

export const adminUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  displayName: z.string(),
  siteRole: siteRoleSchema,
  groupCount: z.number().int(),
  lastLoginAt: z.string().nullable(),
  createdAt: z.string(),
  /** When a site admin disabled the account (it cannot sign in or use its tokens); null while active. */
  disabledAt: z.string().nullable(),
});
export type AdminUser = z.infer<typeof adminUserSchema>;

/** Every action the audit log records, `<what>.<verb>`; the API refuses to record any other. */
export const AUDIT_ACTIONS = [
  'auth.login', 'auth.login_failed', 'auth.logout',
  'user.password_change', 'user.disable', 'user.enable',
  'group.create', 'group.update', 'group.retention_change',
  'membership.invite', 'membership.invite_revoke', 'membership.join', 'membership.remove', 'membership.role_change',
  'model.create', 'model.update', 'model.delete',
  'region.create', 'region.delete',
  'scan.create', 'scan.cancel', 'scan.retry', 'scan.delete', 'scan.refine', 'scan.reproduce',
  'comment.delete',
  'token.create', 'token.revoke',
  'likelihood_set.create',
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

/** What an audit event's `targetId` names. */
export const AUDIT_TARGET_TYPES = ['user', 'group', 'invitation', 'model', 'constraint-region', 'scan', 'comment', 'api_token', 'likelihood_set'] as const;
export type AuditTargetType = (typeof AUDIT_TARGET_TYPES)[number];

export const auditEventSchema = z.object({
  id: z.number().int(),
  action: z.string(),
  actorId: z.number().int().nullable(),
  actorEmail: z.string().nullable(),
  groupId: z.number().int().nullable(),
  targetType: z.string().nullable(),
  targetId: z.string().nullable(),
  details: z.record(z.string(), z.unknown()),
  createdAt: z.string(),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;

/** Every paged list answers with this envelope. */
export function pageOf<T extends z.ZodType>(item: T) {
  return z.object({ items: z.array(item), total: z.number().int(), page: z.number().int(), pageSize: z.number().int() });
}
export type Page<T> = { items: T[]; total: number; page: number; pageSize: number };
