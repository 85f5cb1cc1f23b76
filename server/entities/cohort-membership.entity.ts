import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import { CohortEntity } from './cohort.entity';
import { UserEntity } from './user.entity';

/** A member of a cohort: a contributor shares trials; an observer (a student) only reads. */
@Entity('cohort_memberships')
@Index('cohort_memberships_cohort_user_key', ['cohortId', 'userId'], { unique: true })
@Index('cohort_memberships_cohort_pseudonym_key', ['cohortId', 'pseudonym'], { unique: true })
export class CohortMembershipEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'cohort_id', type: 'uuid' })
  cohortId: string;

  @ManyToOne(() => CohortEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'cohort_id' })
  cohort: Relation<CohortEntity>;

  @Index('cohort_memberships_user_idx')
  @Column({ name: 'user_id', type: 'uuid' })
  userId: string;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user: Relation<UserEntity>;

  @Column({ type: 'varchar', length: 16 })
  role: 'contributor' | 'observer';

  /** How the member appears to everyone else in the cohort; never the real name. */
  @Column({ type: 'varchar', length: 32 })
  pseudonym: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
