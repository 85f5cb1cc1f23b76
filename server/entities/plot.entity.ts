import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import type { PlotSetting } from '@shared/schemas/plots';
import { TrialEntity } from './trial.entity';

@Entity('plots')
@Index('plots_trial_label_key', ['trialId', 'label'], { unique: true })
export class PlotEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'trial_id', type: 'uuid' })
  trialId: string;

  @ManyToOne(() => TrialEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'trial_id' })
  trial: Relation<TrialEntity>;

  // Natural order (B2 before B10): migration NaturalLabelOrder.
  @Column({ type: 'varchar', length: 40, collation: 'natural_sort' })
  label: string;

  @Column({ type: 'varchar', length: 40, nullable: true })
  treatment: string | null;

  @Column({ name: 'block_key', type: 'varchar', length: 40, collation: 'natural_sort' })
  blockKey: string;

  @Column({ name: 'area_m2', type: 'double precision' })
  areaM2: number;

  @Column({ type: 'varchar', length: 12, default: 'in_ground' })
  setting: PlotSetting;

  @Column({ type: 'boolean', default: false })
  mulch: boolean;

  @Column({ type: 'boolean', default: true })
  lid: boolean;

  @Column({ name: 'plant_count', type: 'integer', default: 1 })
  plantCount: number;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
