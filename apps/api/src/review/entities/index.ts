import { RefereeConflict } from './referee-conflict.entity.js';
import { ReviewAssignment } from './review-assignment.entity.js';
import { ReviewReminder } from './review-reminder.entity.js';

/** The entities of the review module, listed once: database/entities.ts and the module use this list. */
export const reviewEntities: (new () => object)[] = [
  ReviewAssignment,
  RefereeConflict,
  ReviewReminder,
];
