import { PIVOT_AXES } from '@sixtyfold/shared';

/** True for the axes that set N_* rather than a parameter of the potential. */
export const isPivotAxis = (parameter: string) => (PIVOT_AXES as readonly string[]).includes(parameter);
