import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import { CohortEntity } from './cohort.entity';
import { UserEntity } from './user.entity';

/** An e-mailed invitation link to join a cohort; the token is stored hashed. */
@Entity('cohort_invitations')
export class CohortInvitationEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index('cohort_invitations_cohort_idx')
  @Column({ name: 'cohort_id', type: 'uuid' })
  cohortId: string;

  @ManyToOne(() => CohortEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'cohort_id' })
  cohort: Relation<CohortEntity>;

  @Column({ type: 'varchar', length: 254 })
  email: string;

  @Column({ type: 'varchar', length: 16 })
  role: 'contributor' | 'observer';

  @Index('cohort_invitations_token_key', { unique: true })
  @Column({ name: 'token_hash', type: 'varchar', length: 64 })
  tokenHash: string;

  @Column({ name: 'expires_at', type: 'timestamptz' })
  expiresAt: Date;

  @Column({ name: 'accepted_at', type: 'timestamptz', nullable: true })
  acceptedAt: Date | null;

  @Column({ name: 'invited_by_id', type: 'uuid' })
  invitedById: string;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'invited_by_id' })
  invitedBy: Relation<UserEntity>;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
