import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  type Relation,
  UpdateDateColumn,
} from 'typeorm';
import { GelKitEntity } from './gel-kit.entity.js';

/** One gel in a kit. Names are unique within the kit: results name the gels to cut. */
@Entity('gear_gel_pieces')
@Index('uq_gear_gel_pieces_kit_name', ['kitId', 'name'], { unique: true })
export class GelPieceEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid' })
  kitId: string;

  @ManyToOne(() => GelKitEntity, (k) => k.pieces, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'kit_id', foreignKeyConstraintName: 'fk_gear_gel_pieces_kit' })
  kit?: Relation<GelKitEntity>;

  @Column({ type: 'text' })
  name: string;

  /** Mired shift, + warms (CTO family), − cools (CTB family). */
  @Column({ type: 'double precision' })
  miredShift: number;

  /** Green–magenta shift, CC units, + adds green. */
  @Column({ type: 'double precision' })
  greenShift: number;

  @Column({ type: 'double precision' })
  lossStops: number;

  /** Order in the kit as shown to people. */
  @Column({ type: 'integer' })
  position: number;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz' })
  updatedAt: Date;
}
