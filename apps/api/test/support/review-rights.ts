import type { RightsRow } from './rights.js';

/** Rows of the rights matrix for the review module's routes (rights-matrix.e2e-spec.ts spreads them). */
export const REVIEW_ROWS: RightsRow[] = [];

/** Route prefixes under which every served route of the review module must have a row. */
export const REVIEW_MATRIX_PREFIXES: string[] = [];
