// The hot path: turns a presented bearer key into a Principal.
// Lookups are cached for a FIXED 30 s (never extended by hits) and only while this instance is
// LISTENing on `lw_api_keys`: every revocation or rotation NOTIFYs inside its transaction, so
// every instance drops the entry as the change commits. Without the listener nothing is cached.
import {
  Inject,
  Injectable,
  Logger,
  OnApplicationBootstrap,
  OnApplicationShutdown,
} from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import pg from 'pg';
import { DataSource } from 'typeorm';
import type { Principal } from '../common/guards/access.guard.js';
import { APP_CONFIG, AppConfig } from '../config/config.js';
import { sameDigest, sha256Hex } from '../auth/tokens.js';
import type { KeyEnvironment } from './api-key.entity.js';
import { parseKey } from './key-format.js';
import { LastUsedRecorder } from './last-used.recorder.js';

export const KEY_CHANNEL = 'lw_api_keys';
const TTL_MS = 30_000;
const MAX_ENTRIES = 50_000;

interface KeyRow {
  id: string;
  organizationId: string;
  environment: KeyEnvironment;
  secretHash: string;
  previousSecretHash: string | null;
  previousSecretExpiresAt: Date | null;
  expiresAt: Date | null;
  revokedAt: Date | null;
}

@Injectable()
export class KeyVerifier implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger('KeyVerifier');
  private readonly cache = new Map<string, { row: KeyRow; loadedAt: number }>();
  private listener: pg.Client | null = null;
  private listening = false;
  private closing = false;
  /** Bumped by every invalidation: a lookup that raced one is not cached. */
  private generation = 0;

  constructor(
    @InjectDataSource() private readonly ds: DataSource,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly lastUsed: LastUsedRecorder,
  ) {}

  async onApplicationBootstrap(): Promise<void> {
    await this.listen();
  }

  async onApplicationShutdown(): Promise<void> {
    this.closing = true;
    this.listening = false;
    const l = this.listener;
    this.listener = null;
    await l?.end().catch(() => undefined);
  }

  private async listen(): Promise<void> {
    const client = new pg.Client({
      connectionString: this.config.databaseUrl,
      application_name: 'lumenwright-keys',
    });
    const lost = (why: string) => {
      if (this.listener !== client) return;
      this.listening = false;
      this.listener = null;
      this.invalidateAll();
      if (this.closing) return;
      this.logger.warn(`key invalidation listener lost (${why}); caching off until it reconnects`);
      setTimeout(() => void this.listen().catch(() => undefined), 1000).unref();
    };
    client.on('notification', (n) => {
      if (n.channel !== KEY_CHANNEL) return;
      this.generation++;
      if (n.payload) this.cache.delete(n.payload);
      else this.cache.clear();
    });
    client.on('error', (e) => lost(e.message));
    client.on('end', () => lost('connection ended'));
    this.listener = client;
    try {
      await client.connect();
      await client.query(`LISTEN ${KEY_CHANNEL}`);
      this.listening = true;
    } catch (e) {
      lost((e as Error).message);
    }
  }

  private invalidateAll() {
    this.generation++;
    this.cache.clear();
  }

  /** Drops an entry on this instance at once (others drop it on the NOTIFY). */
  invalidateLocal(publicId: string) {
    this.generation++;
    this.cache.delete(publicId);
  }

  async verify(token: string): Promise<Principal | null> {
    const parsed = parseKey(token);
    if (!parsed) return null;
    const row = await this.lookup(parsed.publicId);
    if (!row || row.environment !== parsed.environment || row.revokedAt) return null;
    const now = Date.now();
    if (row.expiresAt && row.expiresAt.getTime() <= now) return null;
    const presented = sha256Hex(parsed.secret);
    const current = sameDigest(presented, row.secretHash);
    const previous =
      !current &&
      !!row.previousSecretHash &&
      !!row.previousSecretExpiresAt &&
      row.previousSecretExpiresAt.getTime() > now &&
      sameDigest(presented, row.previousSecretHash);
    if (!current && !previous) return null;
    this.lastUsed.touch(row.id);
    return {
      kind: 'api-key',
      userId: null,
      organizationId: row.organizationId,
      role: null,
      keyId: row.id,
      keyMode: row.environment,
    };
  }

  private async lookup(publicId: string): Promise<KeyRow | null> {
    const hit = this.cache.get(publicId);
    if (hit && this.listening && Date.now() - hit.loadedAt < TTL_MS) return hit.row;
    if (hit) this.cache.delete(publicId);
    const gen = this.generation;
    const rows: KeyRow[] = await this.ds.query(
      `SELECT id, organization_id AS "organizationId", environment, secret_hash AS "secretHash",
              previous_secret_hash AS "previousSecretHash",
              previous_secret_expires_at AS "previousSecretExpiresAt",
              expires_at AS "expiresAt", revoked_at AS "revokedAt"
         FROM api_keys WHERE public_id = $1`,
      [publicId],
    );
    const row = rows[0] ?? null;
    // Unknown ids are not cached (guessing ids must not fill memory).
    if (row && this.listening && gen === this.generation) {
      if (this.cache.size >= MAX_ENTRIES) {
        const oldest = this.cache.keys().next().value;
        if (oldest !== undefined) this.cache.delete(oldest);
      }
      this.cache.set(publicId, { row, loadedAt: Date.now() });
    }
    return row;
  }
}
