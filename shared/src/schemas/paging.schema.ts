import { z } from 'zod';
import { AUDIT_ACTIONS, AUDIT_TARGET_TYPES } from './admin.schema.js';

/** `?page=&pageSize=` of every paged list; page numbers start at 1. */
export const pageQuerySchema = z.object({
  page: z.coerce.number().int().min(1, 'page starts at 1').default(1),
  pageSize: z.coerce.number().int().min(1).max(500, 'pageSize is at most 500').default(50),
});
export type PageQuery = z.infer<typeof pageQuerySchema>;

export const auditQuerySchema = pageQuerySchema.extend({
  action: z.enum(AUDIT_ACTIONS, { error: 'not an action the audit log records' }).optional(),
  /** A user's id, or `none` for what happened without one (the nightly retention, sign-ins of unknown addresses). */
  actorId: z.union([z.literal('none'), z.coerce.number().int().positive()], { error: 'actorId is a user id or none' }).optional(),
  groupId: z.coerce.number().int().positive().optional(),
  targetType: z.enum(AUDIT_TARGET_TYPES, { error: 'not a target type of the audit log' }).optional(),
  /** ISO date or date-time; `from` inclusive, `to` exclusive (a plain date `to` means up to the end of that day). */
  from: z.iso.date().or(z.iso.datetime({ offset: true })).optional(),
  to: z.iso.date().or(z.iso.datetime({ offset: true })).optional(),
});
export type AuditQuery = z.infer<typeof auditQuerySchema>;
