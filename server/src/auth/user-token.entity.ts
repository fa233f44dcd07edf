import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
} from 'typeorm';
import { UserEntity } from '../users/user.entity.js';

export type UserTokenPurpose = 'password_reset' | 'email_change';

/** Single-use, expiring tokens sent by e-mail; only their SHA-256 is stored. */
@Entity('user_tokens')
@Check('user_tokens_purpose_check', `purpose IN ('password_reset', 'email_change')`)
@Index('ix_user_tokens_user', ['userId'])
@Index('uq_user_tokens_token_hash', ['tokenHash'], { unique: true })
export class UserTokenEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid' })
  userId: string;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'fk_user_tokens_user' })
  user?: UserEntity;

  @Column({ type: 'text' })
  purpose: UserTokenPurpose;

  @Column({ type: 'text' })
  tokenHash: string;

  /** For e-mail changes: the address to switch to once confirmed. */
  @Column({ type: 'citext', nullable: true })
  newEmail: string | null;

  @Column({ type: 'timestamptz' })
  expiresAt: Date;

  @Column({ type: 'timestamptz', nullable: true })
  usedAt: Date | null;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;
}
