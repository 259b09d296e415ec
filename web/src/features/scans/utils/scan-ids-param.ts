/** Most scans the compare view puts side by side. */
export const MAX_COMPARED_SCANS = 4;

/** Reads `?scans=1,2` into unique positive ids, in order, at most MAX_COMPARED_SCANS. */
export function parseScanIds(param: string | null): number[] {
  if (!param) return [];
  const ids: number[] = [];
  for (const part of param.split(',')) {
    const id = Number(part.trim());
    if (Number.isInteger(id) && id > 0 && !ids.includes(id)) ids.push(id);
  }
  return ids.slice(0, MAX_COMPARED_SCANS);
}

export const formatScanIds = (ids: number[]): string => ids.join(',');
