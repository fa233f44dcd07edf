// Demo-scenario seeders, run in order by `npm run seed`; each must be idempotent.
import type { DataSource } from 'typeorm';

export type Seeder = { name: string; run: (ds: DataSource) => Promise<void> };

export const SEEDERS: Seeder[] = [];
