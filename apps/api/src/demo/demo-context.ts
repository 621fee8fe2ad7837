import type { User } from '../users/entities/user.entity.js';

/** What the demo's sections share while loading: the clock, the password, what was made so far. */
export interface DemoContext {
  now: Date;
  password: string;
  users: Map<string, User>;
}
