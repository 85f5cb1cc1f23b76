import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import type { NotificationKind } from '@shared/schemas/notifications';
import { UserEntity } from './user.entity';

/**
 * One reminder item claimed for sending: a pot's refill reminder on a day, a garden's frost
 * night, a cohort's weekly digest. The unique key (user, kind, subject, day) is what makes sends
 * idempotent: a row is claimed ('pending') before the e-mail goes out and marked 'sent' after;
 * a retry finds it and skips it, unless it is a claim left 'pending' by a crash for longer than
 * the stale window (see server/services/reminders.service.ts).
 */
@Entity('notification_sends')
@Index('notification_sends_key', ['userId', 'kind', 'subjectKey', 'day'], { unique: true })
export class NotificationSendEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'user_id', type: 'uuid' })
  userId: string;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user: Relation<UserEntity>;

  @Column({ type: 'varchar', length: 12 })
  kind: NotificationKind;

  /** The pot (refill), garden (frost) or cohort (digest) the item is about. */
  @Column({ name: 'subject_key', type: 'varchar', length: 80 })
  subjectKey: string;

  /** The garden's day (refill), the frost night (frost) or the week's Monday (digest). */
  @Column({ type: 'date' })
  day: string;

  @Column({ type: 'varchar', length: 10, default: 'pending' })
  status: 'pending' | 'sent';

  /** When the current claim was taken (null: released after a failed send, free to claim again). */
  @Column({ name: 'claimed_at', type: 'timestamptz', nullable: true })
  claimedAt: Date | null;

  @Column({ type: 'integer', default: 1 })
  attempts: number;

  @Column({ name: 'sent_at', type: 'timestamptz', nullable: true })
  sentAt: Date | null;

  /** What the message said about the subject (level, temperature, digest flags) for the next digest and for support. */
  @Column({ type: 'jsonb', default: () => `'{}'` })
  payload: Record<string, unknown>;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
