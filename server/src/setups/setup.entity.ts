import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import type { DuskSetupPlan } from '@lumenwright/shared';
import { OrganizationEntity } from '../organizations/organization.entity.js';
import { UserEntity } from '../users/user.entity.js';

/**
 * A saved dusk setup: the inputs as the photographer sent them (possibly naming gear by id),
 * the same inputs with the gear resolved to values at save time, and the plan computed from
 * them. Later gear edits do not rewrite a saved plan.
 */
@Entity('setups')
@Index('ix_setups_org_created', ['organizationId', 'createdAt', 'id'])
export class SetupEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid' })
  organizationId: string;

  @ManyToOne(() => OrganizationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organization_id', foreignKeyConstraintName: 'fk_setups_organization' })
  organization?: OrganizationEntity;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text', nullable: true })
  venue: string | null;

  @Column({ type: 'text', nullable: true })
  notes: string | null;

  /** Local shoot date, YYYY-MM-DD (from the inputs). */
  @Column({ type: 'date' })
  shootDate: string;

  /** IANA time zone (from the inputs). */
  @Column({ type: 'text' })
  timeZone: string;

  @Column({ type: 'jsonb' })
  inputs: Record<string, unknown>;

  @Column({ type: 'jsonb' })
  resolvedInputs: Record<string, unknown>;

  @Column({ type: 'jsonb' })
  plan: DuskSetupPlan;

  @Column({ type: 'uuid', nullable: true })
  createdByUserId: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'created_by_user_id', foreignKeyConstraintName: 'fk_setups_created_by' })
  createdBy?: UserEntity | null;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz' })
  updatedAt: Date;
}
