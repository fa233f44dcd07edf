// Fixed-window attempt counters in PostgreSQL (shared by every instance): failed sign-ins per
// address and per e-mail, sign-ups per address, reset requests per e-mail. Keys are hashed so the
// table holds no e-mail addresses; the same limits apply to addresses that exist and that don't.
import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { sha256Hex } from './tokens.js';

export interface ThrottleRule {
  key: string;
  limit: number;
  windowSeconds: number;
}

export const WINDOW_SECONDS = 15 * 60;
export const SIGN_IN_LIMIT_PER_EMAIL = 5;
export const SIGN_IN_LIMIT_PER_IP = 50;

export function signInRules(email: string, ip: string | null): ThrottleRule[] {
  return [
    {
      key: 'signin:email:' + sha256Hex(email.trim().toLowerCase()),
      limit: SIGN_IN_LIMIT_PER_EMAIL,
      windowSeconds: WINDOW_SECONDS,
    },
    {
      key: 'signin:ip:' + sha256Hex(ip ?? 'unknown'),
      limit: SIGN_IN_LIMIT_PER_IP,
      windowSeconds: WINDOW_SECONDS,
    },
  ];
}

@Injectable()
export class AttemptThrottle {
  constructor(@InjectDataSource() private readonly ds: DataSource) {}

  /** Seconds to wait when any rule is exhausted, else 0. */
  async retryAfter(rules: ThrottleRule[]): Promise<number> {
    const rows: { key: string; failures: number; remaining: number }[] = await this.ds.query(
      `SELECT key, failures,
              ceil(extract(epoch FROM window_started_at - now()))::int AS remaining
         FROM auth_throttle WHERE key = ANY($1)`,
      [rules.map((r) => r.key)],
    );
    let wait = 0;
    for (const r of rules) {
      const row = rows.find((x) => x.key === r.key);
      if (!row) continue;
      const left = row.remaining + r.windowSeconds; // window start - now + window
      if (left > 0 && row.failures >= r.limit) wait = Math.max(wait, left);
    }
    return wait;
  }

  /**
   * Counts one attempt against every rule (a new window starts once the old one is over): the
   * caller decides what counts — a failed sign-in, any sign-up, any reset request.
   */
  async count(rules: ThrottleRule[]): Promise<void> {
    for (const r of rules) {
      await this.ds.query(
        `INSERT INTO auth_throttle (key, window_started_at, failures) VALUES ($1, now(), 1)
         ON CONFLICT (key) DO UPDATE SET
           failures = CASE WHEN auth_throttle.window_started_at < now() - make_interval(secs => $2)
                           THEN 1 ELSE auth_throttle.failures + 1 END,
           window_started_at = CASE WHEN auth_throttle.window_started_at < now() - make_interval(secs => $2)
                                    THEN now() ELSE auth_throttle.window_started_at END`,
        [r.key, r.windowSeconds],
      );
    }
  }

  async clear(key: string): Promise<void> {
    await this.ds.query(`DELETE FROM auth_throttle WHERE key = $1`, [key]);
  }
}
