import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, type Relation } from 'typeorm';
import type { Crop, TrialDesign, TrialStatus } from '@shared/schemas/trials';
import { GardenEntity } from './garden.entity';
import { UserEntity } from './user.entity';

@Entity('trials')
export class TrialEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index('trials_garden_idx')
  @Column({ name: 'garden_id', type: 'uuid' })
  gardenId: string;

  @ManyToOne(() => GardenEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'garden_id' })
  garden: Relation<GardenEntity>;

  /** Copied from the garden so access checks need one lookup. */
  @Index('trials_owner_idx')
  @Column({ name: 'owner_id', type: 'uuid' })
  ownerId: string;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'owner_id' })
  owner: Relation<UserEntity>;

  @Column({ type: 'varchar', length: 120 })
  title: string;

  @Column({ type: 'varchar', length: 20 })
  crop: Crop;

  @Column({ name: 'crop_name', type: 'varchar', length: 60, default: '' })
  cropName: string;

  @Column({ type: 'varchar', length: 80, default: '' })
  variety: string;

  @Column({ name: 'planting_date', type: 'date' })
  plantingDate: string;

  @Column({ name: 'end_date', type: 'date', nullable: true })
  endDate: string | null;

  @Column({ type: 'varchar', length: 10, default: 'paired' })
  design: TrialDesign;

  @Column({ type: 'jsonb', default: () => `'["olla", "surface"]'` })
  treatments: string[];

  @Column({ type: 'text', default: '' })
  question: string;

  @Column({ name: 'protocol_notes', type: 'text', default: '' })
  protocolNotes: string;

  @Column({ name: 'kc_overrides', type: 'jsonb', default: () => `'{}'` })
  kcOverrides: { ini?: number; mid?: number; end?: number };

  @Column({ name: 'stress_thresholds', type: 'jsonb', default: () => `'{}'` })
  stressThresholds: Record<string, number>;

  @Column({ type: 'varchar', length: 10, default: 'draft' })
  status: TrialStatus;

  /** The seed of the last randomised assignment, so it can be reproduced. */
  @Column({ name: 'randomisation_seed', type: 'varchar', length: 64, nullable: true })
  randomisationSeed: string | null;

  /**
   * Bumped by database triggers in the same transaction as every write to the trial's water
   * events, moisture readings, harvests or plots; the log rollups (log-rollups.entity.ts) are
   * valid only for the version they were computed at. Never set by the application.
   */
  @Column({ name: 'data_version', type: 'bigint', default: 0, select: false, insert: false, update: false })
  dataVersion: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
