
/** Every query read from a scan's stored points (slices, the plane, single points) starts with this key. */
export const scanResultsKey = (scanId: number) => ['scans', 'results', scanId] as const;
