
/** A whole number from a route parameter (a scan id, a point index); anything else is none. */
export const readWholeNumber = (value: string | undefined): number | null => (value && /^\d{1,15}$/.test(value) ? Number(value) : null);
