import {
  Column,
  CreateDateColumn,
  Entity,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import { PlanEntity } from '../plans/plan.entity.js';

/** A studio, or a company that builds photographers' apps: the tenant everything belongs to. */
@Entity('organizations')
export class OrganizationEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  name: string;

  /** The plan's code; the plans feature owns the plans table and its foreign key. */
  @Column({ type: 'text', default: 'free' })
  planCode: string;

  /** The foreign key is created by the plans migration (fk_organizations_plan). */
  @ManyToOne(() => PlanEntity, { onUpdate: 'CASCADE', onDelete: 'NO ACTION' })
  @JoinColumn({
    name: 'plan_code',
    referencedColumnName: 'code',
    foreignKeyConstraintName: 'fk_organizations_plan',
  })
  plan?: PlanEntity;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz' })
  updatedAt: Date;
}
