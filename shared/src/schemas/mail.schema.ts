import { z } from 'zod';

/** A message the local mail catcher received (development and tests only). */
export const outboxMessageSummarySchema = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string().nullable(),
  to: z.array(z.string()),
  subject: z.string(),
});
export type OutboxMessageSummary = z.infer<typeof outboxMessageSummarySchema>;

export const outboxMessageSchema = outboxMessageSummarySchema.extend({
  text: z.string(),
  /** The HTML body as sent; show it only in a sandboxed frame. */
  html: z.string().nullable(),
  messageId: z.string().nullable(),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;

export const outboxQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
  /** Only messages to this address (exact, case-insensitive). */
  to: z.string().trim().toLowerCase().optional(),
});
export type OutboxQuery = z.infer<typeof outboxQuerySchema>;
