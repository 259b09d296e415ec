/** A 1-based page number from the URL; anything odd means page 1. */
export function readPage(value: string | null): number {
  const page = Number(value);
  return Number.isInteger(page) && page > 0 ? page : 1;
}
