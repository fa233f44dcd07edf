// Keeps monthly partitions of usage_events ahead of time (this month and the next two), so the
// default partition stays empty in normal operation. Run at boot and twice a day.
import { Inject, Injectable, Logger, OnModuleInit, OnModuleDestroy } from '@nestjs/common';
import pg from 'pg';
import { USAGE_POOL } from './usage-writer.service.js';

export function monthPartitions(
  now: Date,
  ahead = 2,
): { name: string; from: string; to: string }[] {
  const out = [];
  for (let i = 0; i <= ahead; i++) {
    const start = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() + i, 1));
    const end = new Date(Date.UTC(start.getUTCFullYear(), start.getUTCMonth() + 1, 1));
    const ym = start.toISOString().slice(0, 7).replace('-', '_');
    out.push({
      name: `usage_events_${ym}`,
      from: start.toISOString().slice(0, 10),
      to: end.toISOString().slice(0, 10),
    });
  }
  return out;
}

/** The month's partition, if missing. Names and bounds come from dates we format, never input. */
export function partitionDdl(p: { name: string; from: string; to: string }): string {
  return `CREATE TABLE IF NOT EXISTS ${p.name} PARTITION OF usage_events
    FOR VALUES FROM ('${p.from}') TO ('${p.to}')`;
}

@Injectable()
export class UsagePartitions implements OnModuleInit, OnModuleDestroy {
  private readonly logger = new Logger('UsagePartitions');
  private timer: NodeJS.Timeout | null = null;

  constructor(@Inject(USAGE_POOL) private readonly pool: pg.Pool) {}

  onModuleInit(): void {
    void this.ensure();
    this.timer = setInterval(() => void this.ensure(), 12 * 3600_000);
    this.timer.unref();
  }

  onModuleDestroy(): void {
    if (this.timer) clearInterval(this.timer);
  }

  async ensure(now = new Date()): Promise<void> {
    for (const p of monthPartitions(now)) {
      try {
        await this.pool.query(partitionDdl(p));
      } catch (err) {
        // Two instances racing, or rows for that month already in the default partition.
        this.logger.warn(`could not create partition ${p.name}: ${String(err)}`);
      }
    }
  }
}
