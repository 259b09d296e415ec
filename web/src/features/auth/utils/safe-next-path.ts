/**
 * The `next` parameter comes from the URL, so only accept paths inside this app:
 * "/scans?page=2" yes, "//evil.example" or "https://…" no.
 */
export function safeNextPath(next: string | null | undefined, fallback: string): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return fallback;
  if (next.startsWith('/sign-in')) return fallback;
  return next;
}
