// Every TypeORM entity, listed once. Add new entities here.
export const ENTITIES: (new (...args: never[]) => unknown)[] = [];
