import { CalendarFeed } from './calendar-feed.entity.js';
import { PlanSettings } from './plan-settings.entity.js';
import { Run } from './run.entity.js';

/** The entities of the plan module, listed once: database/entities.ts and the module use this list. */
export const planEntities: (new () => object)[] = [PlanSettings, Run, CalendarFeed];
