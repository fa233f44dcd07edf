import { Check, Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { OrganizationEntity } from '../organizations/organization.entity.js';

export type IdempotencyState = 'in_flight' | 'done';

/**
 * One `Idempotency-Key` a caller sent to a metered POST: the request's fingerprint, and once the
 * request has finished, the response to replay. A key is the caller's own (an API key, or a
 * console user in one organisation); rows expire 24 h after the first request and are swept.
 */
@Entity('idempotency_keys')
@Index('ix_idempotency_keys_expires', ['expiresAt'])
@Check('idempotency_keys_state_check', `state IN ('in_flight', 'done')`)
export class IdempotencyKeyEntity {
  /** `key:<api key id>`, or `user:<user id>:<organisation id>` for a console session. */
  @PrimaryColumn({ type: 'text', primaryKeyConstraintName: 'pk_idempotency_keys' })
  caller: string;

  /** The key as the caller sent it (1-255 printable ASCII characters). */
  @PrimaryColumn({ type: 'text', primaryKeyConstraintName: 'pk_idempotency_keys' })
  key: string;

  @Column({ type: 'uuid' })
  organizationId: string;

  @ManyToOne(() => OrganizationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({
    name: 'organization_id',
    foreignKeyConstraintName: 'fk_idempotency_keys_organization',
  })
  organization?: OrganizationEntity;

  /** SHA-256 (hex) of the method, the route and the request body. */
  @Column({ type: 'text' })
  fingerprint: string;

  @Column({ type: 'text' })
  state: IdempotencyState;

  /** The stored response: null while in flight. */
  @Column({ type: 'integer', nullable: true })
  status: number | null;

  @Column({ type: 'jsonb', nullable: true })
  headers: Record<string, string> | null;

  @Column({ type: 'bytea', nullable: true })
  body: Buffer | null;

  /** When the request that holds the key started (a takeover of a stale one resets it). */
  @Column({ type: 'timestamptz', default: () => 'now()' })
  createdAt: Date;

  @Column({ type: 'timestamptz' })
  expiresAt: Date;
}
