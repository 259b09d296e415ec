import { z } from 'zod';
import { groupRoleSchema } from './roles.schema.js';

export const groupSummarySchema = z.object({
  id: z.number().int(),
  slug: z.string(),
  name: z.string(),
  description: z.string(),
  myRole: groupRoleSchema.nullable(),
  memberCount: z.number().int(),
});
export type GroupSummary = z.infer<typeof groupSummarySchema>;

export const groupMemberSchema = z.object({
  userId: z.number().int(),
  displayName: z.string(),
  email: z.string(),
  role: groupRoleSchema,
});
export type GroupMember = z.infer<typeof groupMemberSchema>;

export const groupDetailSchema = groupSummarySchema.extend({ pointLimit: z.number().int(), members: z.array(groupMemberSchema) });
export type GroupDetail = z.infer<typeof groupDetailSchema>;

const groupNameField = z.string({ error: 'Enter a group name' }).trim().min(2, 'Group names have at least 2 characters').max(120, 'Group names are at most 120 characters');
const descriptionField = z.string().trim().max(1000, 'Descriptions are at most 1000 characters');
const pointLimitField = z
  .number({ error: 'The point limit must be a number' })
  .int('The point limit is a whole number of points')
  .min(1, 'The point limit is at least 1')
  .max(100_000_000, 'The point limit is at most 100000000');

/** Body of `POST /api/groups` (site admins); the slug is made from the name. */
export const createGroupSchema = z.object({
  name: groupNameField,
  description: descriptionField.default(''),
  pointLimit: pointLimitField.default(1_000_000),
});
export type CreateGroup = z.infer<typeof createGroupSchema>;

/** Body of `PATCH /api/groups/:id` (site admins): any of the fields. */
export const updateGroupSchema = z
  .object({ name: groupNameField, description: descriptionField, pointLimit: pointLimitField })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: 'Change at least one of name, description or pointLimit' });
export type UpdateGroup = z.infer<typeof updateGroupSchema>;
