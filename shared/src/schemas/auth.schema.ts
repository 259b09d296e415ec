import { z } from 'zod';
import { groupRoleSchema, siteRoleSchema } from './roles.schema.js';

/** Body of `POST /api/auth/login`; the sign-in form validates with the same schema. */
export const loginSchema = z.object({
  email: z.string({ error: 'Enter your e-mail address' }).trim().toLowerCase().pipe(z.email({ message: 'Enter an e-mail address like name@institute.example' })),
  password: z.string({ error: 'Enter your password' }).min(1, 'Enter your password').max(200, 'Passwords are at most 200 characters'),
});
export type Login = z.infer<typeof loginSchema>;

export const NEW_PASSWORD_MIN = 10;

/** The rules for any password someone chooses: a new account's and a changed one. */
export const newPasswordSchema = z
  .string({ error: 'Choose a password' })
  .min(NEW_PASSWORD_MIN, `Choose a password of at least ${NEW_PASSWORD_MIN} characters`)
  .max(200, 'Passwords are at most 200 characters');

/** Body of `POST /api/auth/password`; the change-password form validates with the same schema. */
export const changePasswordSchema = z
  .object({
    currentPassword: z.string({ error: 'Enter your current password' }).min(1, 'Enter your current password').max(200, 'Passwords are at most 200 characters'),
    newPassword: newPasswordSchema,
  })
  .refine((body) => body.newPassword !== body.currentPassword, {
    path: ['newPassword'],
    message: 'Choose a password different from the current one',
  });
export type ChangePassword = z.infer<typeof changePasswordSchema>;

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
