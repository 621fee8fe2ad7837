import type { RightsRow } from './rights.js';

/** Rows of the rights matrix for the plan module's routes (rights-matrix.e2e-spec.ts spreads them). */
export const PLAN_ROWS: RightsRow[] = [];

/** Route prefixes under which every served route of the plan module must have a row. */
export const PLAN_MATRIX_PREFIXES: string[] = [];
