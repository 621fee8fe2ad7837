import type { RightsRow } from './rights.js';

/** Rows of the rights matrix for the assessments module's routes (rights-matrix.e2e-spec.ts spreads them). */
export const ASSESSMENTS_ROWS: RightsRow[] = [];

/** Route prefixes under which every served route of the assessments module must have a row. */
export const ASSESSMENTS_MATRIX_PREFIXES: string[] = [];
