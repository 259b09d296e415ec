import { z } from 'zod';
import { groupRoleSchema, siteRoleSchema } from './roles.schema.js';

/** Body of `POST /api/auth/login`; the sign-in form validates with the same schema. */
export const loginSchema = z.object({
  email: z.string({ error: 'Enter your e-mail address' }).trim().toLowerCase().pipe(z.email({ message: 'Enter an e-mail address like name@institute.example' })),
  password: z.string({ error: 'Enter your password' }).min(1, 'Enter your password').max(200, 'Passwords are at most 200 characters'),
});
export type Login = z.infer<typeof loginSchema>;

export const membershipSummarySchema = z.object({
  groupId: z.number().int(),
  groupSlug: z.string(),
  groupName: z.string(),
  role: groupRoleSchema,
});
export type MembershipSummary = z.infer<typeof membershipSummarySchema>;

/** What `GET /api/auth/me` and a successful login return. */
export const currentUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  displayName: z.string(),
  siteRole: siteRoleSchema,
  memberships: z.array(membershipSummarySchema),
});
export type CurrentUser = z.infer<typeof currentUserSchema>;
