// Deletes expired Idempotency-Key rows (24 h after their first request), at boot and then every
// hour on each instance. Sweeps are idempotent (an expired row is deleted once, whoever gets
// there first), so no lock is needed; an expired row not swept yet is already ignored.
import { Injectable, Logger, OnApplicationBootstrap, OnApplicationShutdown } from '@nestjs/common';
import { IdempotencyService } from './idempotency.service.js';

const SWEEP_EVERY_MS = 3600_000;

@Injectable()
export class IdempotencySweeper implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger('IdempotencySweeper');
  private timer: NodeJS.Timeout | null = null;
  private running: Promise<number> | null = null;

  constructor(private readonly keys: IdempotencyService) {}

  onApplicationBootstrap(): void {
    const run = () =>
      this.sweep().catch((e: unknown) =>
        this.logger.warn(`idempotency key sweep failed: ${(e as Error).message}`),
      );
    void run();
    this.timer = setInterval(() => void run(), SWEEP_EVERY_MS);
    this.timer.unref();
  }

  onApplicationShutdown(): void {
    if (this.timer) clearInterval(this.timer);
  }

  /** One pass; concurrent calls share the pass in progress. Returns how many rows went. */
  sweep(): Promise<number> {
    this.running ??= this.keys.sweep().finally(() => {
      this.running = null;
    });
    return this.running;
  }
}
