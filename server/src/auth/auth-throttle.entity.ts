import { Column, Entity, PrimaryColumn } from 'typeorm';

/** Fixed-window failure counters for sign-in and reset requests, shared by every instance. */
@Entity('auth_throttle')
export class AuthThrottleEntity {
  @PrimaryColumn({ type: 'text' })
  key: string;

  @Column({ type: 'timestamptz' })
  windowStartedAt: Date;

  @Column({ type: 'integer' })
  failures: number;
}
