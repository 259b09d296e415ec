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

export const groupDetailSchema = groupSummarySchema.extend({ members: z.array(groupMemberSchema) });
export type GroupDetail = z.infer<typeof groupDetailSchema>;
