import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import { CohortEntity } from './cohort.entity';
import { TrialEntity } from './trial.entity';

/** A trial shared into a cohort; withdrawing sets withdrawn_at and hides it everywhere. */
@Entity('trial_shares')
@Index('trial_shares_trial_cohort_key', ['trialId', 'cohortId'], { unique: true })
export class TrialShareEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'trial_id', type: 'uuid' })
  trialId: string;

  @ManyToOne(() => TrialEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'trial_id' })
  trial: Relation<TrialEntity>;

  @Index('trial_shares_cohort_idx')
  @Column({ name: 'cohort_id', type: 'uuid' })
  cohortId: string;

  @ManyToOne(() => CohortEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'cohort_id' })
  cohort: Relation<CohortEntity>;

  @CreateDateColumn({ name: 'shared_at', type: 'timestamptz' })
  sharedAt: Date;

  @Column({ name: 'withdrawn_at', type: 'timestamptz', nullable: true })
  withdrawnAt: Date | null;
}
