import { z } from 'zod';
import { pageQuerySchema } from './paging.schema.js';

export const NOTIFICATION_KINDS = ['scan_completed', 'scan_failed', 'scan_cancelled', 'mentioned', 'invited'] as const;
export type NotificationKind = (typeof NOTIFICATION_KINDS)[number];

export const NOTIFICATION_EMAIL_MODES = ['immediate', 'daily', 'never'] as const;
export type NotificationEmailMode = (typeof NOTIFICATION_EMAIL_MODES)[number];

/** What a notification shows and where it links; every field is optional so each kind fills its own. */
export const notificationPayloadSchema = z.object({
  title: z.string(),
  /** A path inside the web app, e.g. `/scans/12`. */
  link: z.string().nullable().default(null),
  scanId: z.number().int().optional(),
  scanName: z.string().optional(),
  pointIndex: z.number().int().nullable().optional(),
  groupId: z.number().int().optional(),
  groupName: z.string().optional(),
  actorName: z.string().optional(),
  excerpt: z.string().optional(),
  donePoints: z.number().int().optional(),
  failedPoints: z.number().int().optional(),
});
export type NotificationPayload = z.infer<typeof notificationPayloadSchema>;

export const notificationSchema = z.object({
  id: z.number().int(),
  kind: z.enum(NOTIFICATION_KINDS),
  payload: notificationPayloadSchema,
  createdAt: z.string(),
  readAt: z.string().nullable(),
});
export type NotificationDto = z.infer<typeof notificationSchema>;

export const notificationListQuerySchema = pageQuerySchema.extend({
  unread: z.enum(['true', 'false']).transform((v) => v === 'true').optional(),
});
export type NotificationListQuery = z.infer<typeof notificationListQuerySchema>;

export const unreadCountSchema = z.object({ unread: z.number().int() });
export type UnreadCount = z.infer<typeof unreadCountSchema>;

export const userPreferencesSchema = z.object({
  /** E-mail for each notification at once, one digest a day, or none. */
  notificationEmail: z.enum(NOTIFICATION_EMAIL_MODES),
});
export type UserPreferences = z.infer<typeof userPreferencesSchema>;

export const digestRunSchema = z.object({ users: z.number().int(), notifications: z.number().int() });
export type DigestRun = z.infer<typeof digestRunSchema>;
