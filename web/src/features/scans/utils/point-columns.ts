import { inputLabel } from '@/lib/point-labels';

// The labels live in lib (the refinement feature's merged table shows them too); the scans feature's files take them from here.
export { FAILURE_LABELS, failureLabel, inputLabel, OUTPUT_LABELS } from '@/lib/point-labels';

/** Axis parameters as choices of a select, by their on-screen names. */
export const axisOptions = (parameters: string[]) => parameters.map((parameter) => ({ value: parameter, label: inputLabel(parameter) }));
