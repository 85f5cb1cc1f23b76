import { Column, Entity, Index, PrimaryColumn } from 'typeorm';

/** The table connect-pg-simple stores express-session sessions in (its documented layout). */
@Entity('session')
export class SessionEntity {
  @PrimaryColumn({ type: 'varchar' })
  sid: string;

  @Column({ type: 'json' })
  sess: unknown;

  @Index('IDX_session_expire')
  @Column({ type: 'timestamp', precision: 6 })
  expire: Date;
}
