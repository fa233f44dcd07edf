export interface Cluster {
  dir: string;
  port: number;
  bin: string;
  start(): { created: boolean };
  stop(): void;
  isRunning(): boolean;
  url(db?: string): string;
  createDatabase(name: string): string;
  psql(sql: string, db?: string): string;
  pid(): number | null;
}
export function findPgBin(): string | null;
export function ensurePgBin(log?: (msg: string) => void): string;
export function cluster(opts: {
  dir: string;
  port: number;
  fast?: boolean;
  log?: (msg: string) => void;
}): Cluster;
export function freePort(): Promise<number>;
