/**
 * @skyhours/calc — every number of SCIENCE.md, shared by the browser (live previews) and the
 * server (validation). Pure functions: no clock, no randomness, SI inside, units in every name.
 *
 * The formula functions assume physically valid arguments; `evaluateObservation` is the
 * validated entry point for a whole observation.
 */
export * from './constants.js';
export * from './errors.js';
export * from './geometry.js';
export * from './line.js';
export * from './observation-types.js';
export * from './observation.js';
export * from './plots.js';
export * from './sensitivity.js';
export * from './sky.js';
export * from './validation.js';
export * from './coordinates.js';
export * from './scores.js';
export * from './plan.js';
export * from './assign.js';
