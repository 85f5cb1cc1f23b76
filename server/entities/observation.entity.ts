import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import { PlotEntity } from './plot.entity';
import { TrialEntity } from './trial.entity';
import { UserEntity } from './user.entity';

/** A note (with photos) about a trial or one of its plots. */
@Entity('observations')
@Index('observations_trial_time_idx', ['trialId', 'observedAt'])
@Index('observations_idem_key', ['trialId', 'idempotencyKey'], { unique: true, where: 'idempotency_key IS NOT NULL' })
export class ObservationEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'trial_id', type: 'uuid' })
  trialId: string;

  @ManyToOne(() => TrialEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'trial_id' })
  trial: Relation<TrialEntity>;

  @Column({ name: 'plot_id', type: 'uuid', nullable: true })
  plotId: string | null;

  @ManyToOne(() => PlotEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'plot_id' })
  plot: Relation<PlotEntity> | null;

  @Column({ name: 'observed_at', type: 'timestamptz' })
  observedAt: Date;

  @Column({ type: 'text' })
  text: string;

  @Column({ name: 'entered_by', type: 'uuid', nullable: true })
  enteredBy: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'entered_by' })
  enterer: Relation<UserEntity> | null;

  @Column({ name: 'idempotency_key', type: 'varchar', length: 64, nullable: true })
  idempotencyKey: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
