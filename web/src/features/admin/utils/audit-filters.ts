import { auditQuerySchema, type AuditQuery } from '@sixtyfold/shared';

/** The audit log's filters, named as the API's query parameters (and the address). */
export type AuditFilters = Pick<AuditQuery, 'action' | 'actorId' | 'groupId' | 'targetType' | 'from' | 'to'>;

export const AUDIT_FILTER_KEYS = ['action', 'actorId', 'groupId', 'targetType', 'from', 'to'] as const satisfies readonly (keyof AuditFilters)[];

/**
 * Reads the filters from query parameters with the API's own schema, field by field: a value the
 * API would refuse (a hand-edited address) is left out rather than failing the whole list.
 */
export function readAuditFilters(params: URLSearchParams): AuditFilters {
  const filters: Record<string, unknown> = {};
  for (const key of AUDIT_FILTER_KEYS) {
    const raw = params.get(key)?.trim();
    if (!raw) continue;
    const parsed = auditQuerySchema.shape[key].safeParse(raw);
    if (parsed.success && parsed.data !== undefined) filters[key] = parsed.data;
  }
  return filters as AuditFilters;
}

/** Every filter key as an address change: set ones written, the rest removed. */
export function auditFilterChanges(filters: AuditFilters): Record<string, string | null> {
  return Object.fromEntries(AUDIT_FILTER_KEYS.map((key) => [key, filters[key] === undefined ? null : String(filters[key])]));
}

export const hasAuditFilters = (filters: AuditFilters) => AUDIT_FILTER_KEYS.some((key) => filters[key] !== undefined);
