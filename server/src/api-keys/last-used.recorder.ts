// Records keys' last use without a write per request: touches collect in memory and one UPDATE
// every few seconds writes them all (last_used_at is therefore accurate to about 5 s).
import { Injectable, Logger, OnApplicationShutdown, OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';

const FLUSH_MS = 5000;

@Injectable()
export class LastUsedRecorder implements OnModuleInit, OnApplicationShutdown {
  private readonly logger = new Logger('LastUsedRecorder');
  private pending = new Map<string, Date>();
  private timer: NodeJS.Timeout | null = null;

  constructor(@InjectDataSource() private readonly ds: DataSource) {}

  onModuleInit() {
    this.timer = setInterval(() => void this.flush(), FLUSH_MS);
    this.timer.unref();
  }

  touch(keyId: string) {
    this.pending.set(keyId, new Date());
  }

  async flush(): Promise<void> {
    if (!this.pending.size) return;
    const batch = this.pending;
    this.pending = new Map();
    try {
      await this.ds.query(
        `UPDATE api_keys k SET last_used_at = v.t
           FROM unnest($1::uuid[], $2::timestamptz[]) AS v(id, t)
          WHERE k.id = v.id AND (k.last_used_at IS NULL OR k.last_used_at < v.t)`,
        [[...batch.keys()], [...batch.values()].map((d) => d.toISOString())],
      );
    } catch (e) {
      this.logger.warn(`could not record key use: ${(e as Error).message}`);
    }
  }

  async onApplicationShutdown() {
    if (this.timer) clearInterval(this.timer);
    if (this.ds.isInitialized) await this.flush();
  }
}
