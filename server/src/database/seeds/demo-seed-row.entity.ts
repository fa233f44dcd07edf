import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { OrganizationEntity } from '../../organizations/organization.entity.js';

/**
 * A row the demo seeder wrote (see the DemoSeedRows migration): which demo item it is, and the
 * version of that item's definition it was written from. Only the seeders read or write it.
 */
@Entity('demo_seed_rows')
export class DemoSeedRowEntity {
  @PrimaryColumn({ type: 'uuid', primaryKeyConstraintName: 'pk_demo_seed_rows' })
  organizationId: string;

  @ManyToOne(() => OrganizationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({
    name: 'organization_id',
    foreignKeyConstraintName: 'fk_demo_seed_rows_organization',
  })
  organization?: OrganizationEntity;

  /** The table's kind of row: `setup`, `frame`. */
  @PrimaryColumn({ type: 'text', primaryKeyConstraintName: 'pk_demo_seed_rows' })
  kind: string;

  /** The demo item's stable key (its name may change between versions). */
  @PrimaryColumn({ type: 'text', primaryKeyConstraintName: 'pk_demo_seed_rows' })
  demoKey: string;

  @Column({ type: 'uuid' })
  rowId: string;

  /** SHA-256 (hex) of the item's definition as written (see demo-versions.ts). */
  @Column({ type: 'text' })
  version: string;

  @CreateDateColumn({ type: 'timestamptz' })
  seededAt: Date;
}
