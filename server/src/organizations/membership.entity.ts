import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import type { Role } from '../common/decorators/access.decorator.js';
import { UserEntity } from '../users/user.entity.js';
import { OrganizationEntity } from './organization.entity.js';

/** A user's role in one organisation. */
@Entity('memberships')
@Check('memberships_role_check', `role IN ('owner', 'admin', 'developer', 'photographer')`)
@Index('uq_memberships_org_user', ['organizationId', 'userId'], { unique: true })
@Index('ix_memberships_user', ['userId'])
export class MembershipEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid' })
  organizationId: string;

  @ManyToOne(() => OrganizationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organization_id', foreignKeyConstraintName: 'fk_memberships_organization' })
  organization?: OrganizationEntity;

  @Column({ type: 'uuid' })
  userId: string;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'fk_memberships_user' })
  user?: UserEntity;

  @Column({ type: 'text' })
  role: Role;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz' })
  updatedAt: Date;
}
