import type { LengthUnit } from '@lumenwright/shared';
import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  Index,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';

/** A person who signs in to the console. E-mail is citext: unique regardless of case. */
@Entity('users')
@Check('users_length_unit_check', `length_unit IN ('m', 'ft')`)
@Index('uq_users_email', ['email'], { unique: true })
export class UserEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'citext' })
  email: string;

  @Column({ type: 'text' })
  name: string;

  /** argon2id PHC string; never the password itself. */
  @Column({ type: 'text' })
  passwordHash: string;

  @Column({ type: 'timestamptz', nullable: true })
  passwordChangedAt: Date | null;

  /** Metres or feet for distances in the console; follows the person across browsers. */
  @Column({ type: 'text', default: 'm' })
  lengthUnit: LengthUnit;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz' })
  updatedAt: Date;
}
