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
});
export type AdminUser = z.infer<typeof adminUserSchema>;

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
