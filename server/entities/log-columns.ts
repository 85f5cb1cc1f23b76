import { Column, CreateDateColumn, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import { PlotEntity } from './plot.entity';
import { TrialEntity } from './trial.entity';
import { UserEntity } from './user.entity';

/**
 * Columns every per-plot log shares: its trial (copied from the plot for access checks and
 * aggregation), plot, who entered it, and an optional idempotency key from offline clients.
 */
export abstract class PlotLogBase {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'trial_id', type: 'uuid' })
  trialId: string;

  @ManyToOne(() => TrialEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'trial_id' })
  trial: Relation<TrialEntity>;

  @Index()
  @Column({ name: 'plot_id', type: 'uuid' })
  plotId: string;

  @ManyToOne(() => PlotEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'plot_id' })
  plot: Relation<PlotEntity>;

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
