import { z } from 'zod';

/** One named parameter of a potential, with the range a scan form offers by default. */
export const modelParameterSchema = z.object({
  name: z.string().regex(/^[A-Za-z][A-Za-z0-9_]*$/, 'Parameter names start with a letter and use letters, digits and _'),
  defaultValue: z.number().finite(),
  min: z.number().finite().optional(),
  max: z.number().finite().optional(),
  description: z.string().max(500).default(''),
});
export type ModelParameter = z.infer<typeof modelParameterSchema>;

/** A group's own potential model as the API returns it. */
export const potentialModelSchema = z.object({
  id: z.number().int(),
  groupId: z.number().int(),
  name: z.string(),
  expression: z.string(),
  parameters: z.array(modelParameterSchema),
  phiInit: z.number().nullable(),
  description: z.string(),
  createdById: z.number().int().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type PotentialModel = z.infer<typeof potentialModelSchema>;
