import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import { TrialEntity } from './trial.entity';
import { UserEntity } from './user.entity';

/** Who changed what in a closed or shared trial, and when. */
@Entity('audit_entries')
@Index('audit_entries_trial_time_idx', ['trialId', 'at'])
export class AuditEntryEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'trial_id', type: 'uuid' })
  trialId: string;

  @ManyToOne(() => TrialEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'trial_id' })
  trial: Relation<TrialEntity>;

  @Column({ name: 'actor_id', type: 'uuid', nullable: true })
  actorId: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'actor_id' })
  actor: Relation<UserEntity> | null;

  @CreateDateColumn({ name: 'at', type: 'timestamptz' })
  at: Date;

  @Column({ type: 'varchar', length: 10 })
  action: 'create' | 'update' | 'delete' | 'status';

  @Column({ name: 'entity_type', type: 'varchar', length: 24 })
  entityType: string;

  @Column({ name: 'entity_id', type: 'uuid' })
  entityId: string;

  /** { field: [before, after] } for updates; the removed record for deletes. */
  @Column({ type: 'jsonb' })
  changes: Record<string, unknown>;
}
