import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  OneToMany,
  PrimaryGeneratedColumn,
  type Relation,
  UpdateDateColumn,
} from 'typeorm';
import { OrganizationEntity } from '../../organizations/organization.entity.js';
import { GelPieceEntity } from './gel-piece.entity.js';

/** A named set of correction gels the studio carries. */
@Entity('gear_gel_kits')
@Index('uq_gear_gel_kits_org_name', ['organizationId', 'name'], { unique: true })
export class GelKitEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid' })
  organizationId: string;

  @ManyToOne(() => OrganizationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({
    name: 'organization_id',
    foreignKeyConstraintName: 'fk_gear_gel_kits_organization',
  })
  organization?: OrganizationEntity;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text', nullable: true })
  notes: string | null;

  @OneToMany(() => GelPieceEntity, (p) => p.kit)
  pieces?: Relation<GelPieceEntity>[];

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz' })
  updatedAt: Date;
}
