import { Column, Entity, Index, PrimaryColumn } from 'typeorm';

/**
 * Console sessions, in the layout connect-pg-simple reads and writes. The migration owns the table
 * (the store's lazy creation is off).
 */
@Entity('sessions')
@Index('ix_sessions_expire', ['expire'])
export class SessionEntity {
  @PrimaryColumn({ type: 'varchar' })
  sid: string;

  @Column({ type: 'json' })
  sess: Record<string, unknown>;

  @Column({ type: 'timestamp', precision: 6 })
  expire: Date;
}
