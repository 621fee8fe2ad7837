import type { RightsRow } from './rights.js';

/** Rows of the rights matrix for the desk module's routes (rights-matrix.e2e-spec.ts spreads them). */
export const DESK_ROWS: RightsRow[] = [];

/** Route prefixes under which every served route of the desk module must have a row. */
export const DESK_MATRIX_PREFIXES: string[] = [];
