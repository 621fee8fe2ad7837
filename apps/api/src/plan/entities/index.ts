/** The entities of the plan module, listed once: database/entities.ts and the module use this list. */
export const planEntities: (new () => object)[] = [];
