import type { RightsRow } from './rights.js';

/** Rows of the rights matrix for the allocation module's routes (rights-matrix.e2e-spec.ts spreads them). */
export const ALLOCATION_ROWS: RightsRow[] = [];

/** Route prefixes under which every served route of the allocation module must have a row. */
export const ALLOCATION_MATRIX_PREFIXES: string[] = [];
