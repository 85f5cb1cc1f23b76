import { Column, Entity, JoinColumn, OneToOne, PrimaryColumn, UpdateDateColumn, type Relation } from 'typeorm';
import { UserEntity } from './user.entity';

/**
 * A user's choices for the messages Seepwise sends on its own. No row means the defaults
 * (everything on, reminders at 25 %); the unsubscribe link writes a row with its kind off.
 */
@Entity('notification_preferences')
export class NotificationPreferenceEntity {
  @PrimaryColumn({ name: 'user_id', type: 'uuid' })
  userId: string;

  @OneToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user: Relation<UserEntity>;

  @Column({ name: 'refill_reminders', type: 'boolean', default: true })
  refillReminders: boolean;

  @Column({ name: 'refill_threshold_pct', type: 'integer', default: 25 })
  refillThresholdPct: number;

  @Column({ name: 'frost_warnings', type: 'boolean', default: true })
  frostWarnings: boolean;

  @Column({ name: 'weekly_digest', type: 'boolean', default: true })
  weeklyDigest: boolean;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
