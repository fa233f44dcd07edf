// Every migration, in order. Add new migrations at the end.
import { Init1764633600000 } from './1764633600000-Init.js';

export const MIGRATIONS = [Init1764633600000];
