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
import { OrganizationEntity } from '../organizations/organization.entity.js';
import { UserEntity } from '../users/user.entity.js';

export type KeyEnvironment = 'test' | 'live';

/**
 * An API key. The secret is never stored: only its SHA-256 (hex). `publicId` is the lookup handle
 * printed in the key's visible prefix. After a rotation the previous secret's hash stays valid
 * until `previousSecretExpiresAt`.
 */
@Entity('api_keys')
@Check('api_keys_environment_check', `environment IN ('test', 'live')`)
@Index('uq_api_keys_public_id', ['publicId'], { unique: true })
@Index('ix_api_keys_org', ['organizationId', 'createdAt'])
export class ApiKeyEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid' })
  organizationId: string;

  @ManyToOne(() => OrganizationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organization_id', foreignKeyConstraintName: 'fk_api_keys_organization' })
  organization?: OrganizationEntity;

  @Column({ type: 'uuid', nullable: true })
  createdByUserId: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'created_by_user_id', foreignKeyConstraintName: 'fk_api_keys_created_by' })
  createdBy?: UserEntity | null;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text' })
  environment: KeyEnvironment;

  @Column({ type: 'text' })
  publicId: string;

  @Column({ type: 'text' })
  secretHash: string;

  @Column({ type: 'text', nullable: true })
  previousSecretHash: string | null;

  @Column({ type: 'timestamptz', nullable: true })
  previousSecretExpiresAt: Date | null;

  @Column({ type: 'timestamptz', nullable: true })
  expiresAt: Date | null;

  @Column({ type: 'timestamptz', nullable: true })
  revokedAt: Date | null;

  @Column({ type: 'uuid', nullable: true })
  revokedByUserId: string | null;

  @Column({ type: 'timestamptz', nullable: true })
  lastUsedAt: Date | null;

  @Column({ type: 'timestamptz', nullable: true })
  rotatedAt: Date | null;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;
}
