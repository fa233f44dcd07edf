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
import type { Role } from '../common/decorators/access.decorator.js';
import { OrganizationEntity } from '../organizations/organization.entity.js';
import { UserEntity } from '../users/user.entity.js';

/** An e-mailed invitation to join an organisation with a role; only the token's hash is kept. */
@Entity('invites')
@Check('invites_role_check', `role IN ('owner', 'admin', 'developer', 'photographer')`)
@Index('ix_invites_org', ['organizationId', 'createdAt'])
@Index('uq_invites_token_hash', ['tokenHash'], { unique: true })
export class InviteEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid' })
  organizationId: string;

  @ManyToOne(() => OrganizationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organization_id', foreignKeyConstraintName: 'fk_invites_organization' })
  organization?: OrganizationEntity;

  @Column({ type: 'citext' })
  email: string;

  @Column({ type: 'text' })
  role: Role;

  @Column({ type: 'text' })
  tokenHash: string;

  @Column({ type: 'uuid', nullable: true })
  invitedByUserId: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'invited_by_user_id', foreignKeyConstraintName: 'fk_invites_invited_by' })
  invitedBy?: UserEntity | null;

  @Column({ type: 'timestamptz' })
  expiresAt: Date;

  @Column({ type: 'timestamptz' })
  lastSentAt: Date;

  @Column({ type: 'timestamptz', nullable: true })
  acceptedAt: Date | null;

  @Column({ type: 'timestamptz', nullable: true })
  canceledAt: Date | null;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;
}
