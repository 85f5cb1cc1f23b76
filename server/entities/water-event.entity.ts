import { Column, Entity, Index, JoinColumn, ManyToOne, type Relation } from 'typeorm';
import type { WaterKind, WaterSource } from '@shared/schemas/logs';
import { PlotLogBase } from './log-columns';
import { PotEntity } from './pot.entity';

/** An olla refill or a surface watering, in litres. */
@Entity('water_events')
@Index('water_events_trial_time_idx', ['trialId', 'occurredAt'])
@Index('water_events_idem_key', ['trialId', 'idempotencyKey'], { unique: true, where: 'idempotency_key IS NOT NULL' })
export class WaterEventEntity extends PlotLogBase {
  @Column({ name: 'occurred_at', type: 'timestamptz' })
  occurredAt: Date;

  @Column({ type: 'varchar', length: 12 })
  kind: WaterKind;

  @Column({ name: 'volume_l', type: 'double precision' })
  volumeL: number;

  @Column({ type: 'varchar', length: 12, default: 'mains' })
  source: WaterSource;

  @Column({ type: 'boolean', default: false })
  fertiliser: boolean;

  @Index('water_events_pot_idx')
  @Column({ name: 'pot_id', type: 'uuid', nullable: true })
  potId: string | null;

  @ManyToOne(() => PotEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'pot_id' })
  pot: Relation<PotEntity> | null;

  @Column({ type: 'text', default: '' })
  notes: string;
}
