/** The entities of the allocation module, listed once: database/entities.ts and the module use this list. */
export const allocationEntities: (new () => object)[] = [];
