/** A 1-based page number from the URL; anything odd means page 1. */
export function readPage(value: string | null): number {
  const page = Number(value);
  return Number.isInteger(page) && page > 0 ? page : 1;
}

/** A record id from the URL (`?from=12`), or null when it is not a positive whole number. */
export function readId(value: string | null): number | null {
  const id = Number(value);
  return value !== null && Number.isInteger(id) && id > 0 ? id : null;
}
