import { z } from 'zod';
import { newPasswordSchema } from './auth.schema.js';
import { groupRoleSchema } from './roles.schema.js';

const emailField = z
  .string({ error: 'Enter an e-mail address' })
  .trim()
  .toLowerCase()
  .pipe(z.email({ message: 'Enter an e-mail address like name@institute.example' }));

/** Body of `POST /api/groups/:id/invitations`; the invite form validates with the same schema. */
export const createInvitationSchema = z.object({
  email: emailField,
  role: groupRoleSchema,
});
export type CreateInvitation = z.infer<typeof createInvitationSchema>;

/** A pending invitation as its group's leads see it. */
export const invitationSchema = z.object({
  id: z.number().int(),
  groupId: z.number().int(),
  email: z.string(),
  role: groupRoleSchema,
  invitedByName: z.string().nullable(),
  createdAt: z.string(),
  expiresAt: z.string(),
  /** The invited address's existing account, if it has one (for in-app notices). */
  inviteeUserId: z.number().int().nullable(),
});
export type Invitation = z.infer<typeof invitationSchema>;
export const invitationListSchema = z.array(invitationSchema);

/** What the public `GET /api/invitations/:token` shows the person who follows the link. */
export const invitationPreviewSchema = z.object({
  groupId: z.number().int(),
  groupName: z.string(),
  role: groupRoleSchema,
  email: z.string(),
  invitedByName: z.string().nullable(),
  expiresAt: z.string(),
  /** true: the person signs in and joins; false: they create their account on the accept page. */
  accountExists: z.boolean(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

/** The account fields a new person gives when accepting an invitation. */
export const newAccountSchema = z.object({
  displayName: z
    .string({ error: 'Enter your name' })
    .trim()
    .min(1, 'Enter your name')
    .max(120, 'Names are at most 120 characters'),
  password: newPasswordSchema,
});
export type NewAccount = z.infer<typeof newAccountSchema>;

/** Body of `POST /api/invitations/:token/accept`: empty for an existing account, the new account's fields otherwise. */
export const acceptInvitationSchema = newAccountSchema.partial();
export type AcceptInvitation = z.infer<typeof acceptInvitationSchema>;

/** Body of `PATCH /api/groups/:id/members/:userId`. */
export const changeMemberRoleSchema = z.object({ role: groupRoleSchema });
export type ChangeMemberRole = z.infer<typeof changeMemberRoleSchema>;

/** What leads may do, in words, for invitation e-mails and the role select. */
export const GROUP_ROLE_DESCRIPTIONS = {
  lead: 'invite and remove people, change roles, and run and delete scans',
  member: 'define models and run scans',
  viewer: 'read the models, scans and results',
} as const;
