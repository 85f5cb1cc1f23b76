import { Column, Entity, Index } from 'typeorm';
import { PlotLogBase } from './log-columns';

@Entity('harvests')
@Index('harvests_trial_day_idx', ['trialId', 'harvestedOn'])
@Index('harvests_idem_key', ['trialId', 'idempotencyKey'], { unique: true, where: 'idempotency_key IS NOT NULL' })
export class HarvestEntity extends PlotLogBase {
  @Column({ name: 'harvested_on', type: 'date' })
  harvestedOn: string;

  @Column({ name: 'fresh_kg', type: 'double precision' })
  freshKg: number;

  @Column({ type: 'integer', nullable: true })
  count: number | null;

  @Column({ name: 'marketable_kg', type: 'double precision', nullable: true })
  marketableKg: number | null;

  @Column({ type: 'text', default: '' })
  notes: string;
}
