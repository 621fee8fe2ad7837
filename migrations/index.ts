import { Foundation1764626400000 } from './1764626400000-foundation.js';
import { ObservatoryAndCalls1764800000000 } from './1764800000000-observatory-and-calls.js';
import { Accounts1764799200000 } from './1764799200000-accounts.js';
import { Documents1764880000000 } from './1764880000000-documents.js';
import { Proposals1764960000000 } from './1764960000000-proposals.js';
import { ReviewAndPlan1765050000000 } from './1765050000000-review-and-plan.js';

/**
 * Every migration in order. A new migration file is added here too; listing them (rather than a
 * glob) lets the app, the CLI and the tests load the very same classes.
 */
export const migrations = [
  Foundation1764626400000,
  Accounts1764799200000,
  ObservatoryAndCalls1764800000000,
  Documents1764880000000,
  Proposals1764960000000,
  ReviewAndPlan1765050000000,
];
