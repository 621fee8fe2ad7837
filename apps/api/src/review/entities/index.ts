/** The entities of the review module, listed once: database/entities.ts and the module use this list. */
export const reviewEntities: (new () => object)[] = [];
