export * from './client.js';
export { LumenwrightError, type Problem } from './errors.js';
export type { paths, components } from './generated/schema.js';
