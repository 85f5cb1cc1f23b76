import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import { CohortEntity } from './cohort.entity';
import { TrialEntity } from './trial.entity';
import { UserEntity } from './user.entity';

/** A cohort lead's decision to leave a shared trial out of the cohort's pooled results, with the reason. */
@Entity('trial_exclusions')
@Index('trial_exclusions_cohort_trial_key', ['cohortId', 'trialId'], { unique: true })
export class TrialExclusionEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'cohort_id', type: 'uuid' })
  cohortId: string;

  @ManyToOne(() => CohortEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'cohort_id' })
  cohort: Relation<CohortEntity>;

  @Index('trial_exclusions_trial_idx')
  @Column({ name: 'trial_id', type: 'uuid' })
  trialId: string;

  @ManyToOne(() => TrialEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'trial_id' })
  trial: Relation<TrialEntity>;

  @Column({ type: 'text' })
  reason: string;

  /** The lead who recorded it (kept if the account is deleted: SET NULL). */
  @Column({ name: 'excluded_by', type: 'uuid', nullable: true })
  excludedBy: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'excluded_by' })
  excluder: Relation<UserEntity> | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
