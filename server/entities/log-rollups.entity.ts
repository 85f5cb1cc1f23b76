import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn, type Relation } from 'typeorm';
import { PlotEntity } from './plot.entity';
import { TrialEntity } from './trial.entity';

/*
 * Per-trial rollups of the raw logs, read by the cohort results page instead of re-aggregating
 * every water event, moisture reading and harvest of 500 trials on each request.
 *
 * They are a cache, never a source: `trials.data_version` is bumped by database triggers in the
 * same transaction as any insert, update or delete of a trial's water events, moisture readings,
 * harvests or plots (migration CohortLogRollups). A trial's rollups are valid only while
 * `trial_log_summaries.data_version` equals it; server/services/log-rollups.ts recomputes the
 * stale ones from the raw rows before they are read. Only the log rows (and the plots' treatment)
 * go into them; everything else on the cohort page (shares, memberships, exclusions, trial dates,
 * plots, pots, gardens) is read live.
 */

/** One row per trial whose rollups are current as of `dataVersion`. */
@Entity('trial_log_summaries')
export class TrialLogSummaryEntity {
  @PrimaryColumn({ name: 'trial_id', type: 'uuid' })
  trialId: string;

  @ManyToOne(() => TrialEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'trial_id' })
  trial: Relation<TrialEntity>;

  /** The trial's `data_version` read before the rollups were computed. */
  @Column({ name: 'data_version', type: 'bigint' })
  dataVersion: string;

  @Column({ name: 'harvest_records', type: 'integer' })
  harvestRecords: number;

  /** Distinct moisture methods, sorted. */
  @Column({ name: 'moisture_methods', type: 'text', array: true })
  moistureMethods: string[];

  @Column({ name: 'computed_at', type: 'timestamptz', default: () => 'now()' })
  computedAt: Date;
}

/** Water and harvest totals of one plot (only plots with at least one water event or harvest). */
@Entity('plot_log_totals')
export class PlotLogTotalEntity {
  @PrimaryColumn({ name: 'plot_id', type: 'uuid' })
  plotId: string;

  @ManyToOne(() => PlotEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'plot_id' })
  plot: Relation<PlotEntity>;

  @Index('plot_log_totals_trial_idx')
  @Column({ name: 'trial_id', type: 'uuid' })
  trialId: string;

  @ManyToOne(() => TrialEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'trial_id' })
  trial: Relation<TrialEntity>;

  @Column({ name: 'water_l', type: 'double precision' })
  waterL: number;

  @Column({ name: 'harvest_kg', type: 'double precision' })
  harvestKg: number;

  @Column({ name: 'harvest_records', type: 'integer' })
  harvestRecords: number;
}

/**
 * Water per trial, event kind, plot treatment ('' for a plot without one) and ISO week (Monday, from
 * the UTC date of each event): litres, number of events and a bitmask of the weekdays with water
 * (bit 0 = Monday), before any season filter (the season is applied when read).
 */
@Entity('trial_week_water')
export class TrialWeekWaterEntity {
  @PrimaryColumn({ name: 'trial_id', type: 'uuid' })
  trialId: string;

  @ManyToOne(() => TrialEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'trial_id' })
  trial: Relation<TrialEntity>;

  @PrimaryColumn({ type: 'varchar', length: 12 })
  kind: string;

  @PrimaryColumn({ type: 'varchar', length: 40 })
  treatment: string;

  @PrimaryColumn({ name: 'week_start', type: 'date' })
  weekStart: string;

  @Column({ type: 'double precision' })
  litres: number;

  @Column({ type: 'integer' })
  events: number;

  @Column({ name: 'day_mask', type: 'integer' })
  dayMask: number;
}
