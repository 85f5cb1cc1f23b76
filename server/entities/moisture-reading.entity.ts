import { Column, Entity, Index } from 'typeorm';
import type { MoistureMethod } from '@shared/schemas/logs';
import { PlotLogBase } from './log-columns';

/** A soil moisture reading on its method's own scale (VWC %, tensiometer kPa, probe index). */
@Entity('moisture_readings')
@Index('moisture_readings_trial_time_idx', ['trialId', 'takenAt'])
@Index('moisture_readings_idem_key', ['trialId', 'idempotencyKey'], { unique: true, where: 'idempotency_key IS NOT NULL' })
export class MoistureReadingEntity extends PlotLogBase {
  @Column({ name: 'taken_at', type: 'timestamptz' })
  takenAt: Date;

  @Column({ type: 'varchar', length: 12 })
  method: MoistureMethod;

  @Column({ name: 'depth_cm', type: 'double precision' })
  depthCm: number;

  @Column({ type: 'double precision' })
  value: number;
}
