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
import type { LengthUnit, ModifierName } from '@lumenwright/shared';
import { OrganizationEntity } from '../../organizations/organization.entity.js';

/** A light-shaping tool the studio owns, with its measured or estimated light loss. */
@Entity('gear_modifiers')
@Index('uq_gear_modifiers_org_name', ['organizationId', 'name'], { unique: true })
export class ModifierEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid' })
  organizationId: string;

  @ManyToOne(() => OrganizationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({
    name: 'organization_id',
    foreignKeyConstraintName: 'fk_gear_modifiers_organization',
  })
  organization?: OrganizationEntity;

  @Column({ type: 'text' })
  name: string;

  /** The kind in the math library's modifier list (sets size defaults); null = unspecified. */
  @Column({ type: 'text', nullable: true })
  kind: ModifierName | null;

  @Column({ type: 'double precision' })
  lossStops: number;

  /** Full beam angle of a grid or reflector, degrees. */
  @Column({ type: 'double precision', nullable: true })
  beamAngleDeg: number | null;

  /** Diameter or diagonal, in sizeUnit. */
  @Column({ type: 'double precision', nullable: true })
  size: number | null;

  @Column({ type: 'text', nullable: true })
  sizeUnit: LengthUnit | null;

  @Column({ type: 'text', nullable: true })
  notes: string | null;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz' })
  updatedAt: Date;
}
