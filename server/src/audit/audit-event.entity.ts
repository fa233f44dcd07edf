import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
} from 'typeorm';
import { OrganizationEntity } from '../organizations/organization.entity.js';

/**
 * Who did what, when, from which address. Actor ids are kept without foreign keys so the history
 * survives a user's or key's deletion; the organisation's deletion removes its history.
 */
@Entity('audit_events')
@Index('ix_audit_events_org_created', ['organizationId', 'createdAt', 'id'])
export class AuditEventEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', nullable: true })
  organizationId: string | null;

  @ManyToOne(() => OrganizationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organization_id', foreignKeyConstraintName: 'fk_audit_events_organization' })
  organization?: OrganizationEntity | null;

  @Column({ type: 'uuid', nullable: true })
  actorUserId: string | null;

  @Column({ type: 'uuid', nullable: true })
  actorKeyId: string | null;

  @Column({ type: 'text' })
  action: string;

  @Column({ type: 'text', nullable: true })
  targetType: string | null;

  @Column({ type: 'text', nullable: true })
  targetId: string | null;

  @Column({ type: 'text', nullable: true })
  ip: string | null;

  @Column({ type: 'text', nullable: true })
  userAgent: string | null;

  @Column({ type: 'jsonb', default: () => "'{}'" })
  metadata: Record<string, unknown>;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;
}
