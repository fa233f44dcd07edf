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
import type { LengthUnit } from '@lumenwright/shared';
import { OrganizationEntity } from '../../organizations/organization.entity.js';

/**
 * A flash the studio owns. The guide number (ISO 100, full power) is either as rated or derived
 * from a meter reading, which is kept so people can see where the number came from.
 */
@Entity('gear_lights')
@Index('uq_gear_lights_org_name', ['organizationId', 'name'], { unique: true })
export class LightEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid' })
  organizationId: string;

  @ManyToOne(() => OrganizationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organization_id', foreignKeyConstraintName: 'fk_gear_lights_organization' })
  organization?: OrganizationEntity;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'double precision' })
  guideNumber: number;

  @Column({ type: 'text' })
  guideNumberUnit: LengthUnit;

  @Column({ type: 'double precision', nullable: true })
  meterAperture: number | null;

  @Column({ type: 'double precision', nullable: true })
  meterDistance: number | null;

  @Column({ type: 'text', nullable: true })
  meterDistanceUnit: LengthUnit | null;

  @Column({ type: 'double precision', nullable: true })
  meterIso: number | null;

  @Column({ type: 'double precision', nullable: true })
  meterPowerFraction: number | null;

  @Column({ type: 'text', nullable: true })
  notes: string | null;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz' })
  updatedAt: Date;
}
