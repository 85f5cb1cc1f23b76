import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, type Relation } from 'typeorm';
import type { ClayBody, PotCondition, PotMake, PotShape } from '@shared/schemas/pots';
import { PlotEntity } from './plot.entity';
import { UserEntity } from './user.entity';

/** An olla on the grower's Pot shelf. */
@Entity('pots')
export class PotEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index('pots_owner_idx')
  @Column({ name: 'owner_id', type: 'uuid' })
  ownerId: string;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'owner_id' })
  owner: Relation<UserEntity>;

  // Natural order (B2 before B10): migration NaturalLabelOrder.
  @Column({ type: 'varchar', length: 40, collation: 'natural_sort' })
  label: string;

  @Column({ name: 'capacity_l', type: 'double precision' })
  capacityL: number;

  @Column({ name: 'height_cm', type: 'double precision', nullable: true })
  heightCm: number | null;

  @Column({ name: 'widest_diameter_cm', type: 'double precision' })
  widestDiameterCm: number;

  @Column({ name: 'neck_diameter_cm', type: 'double precision', nullable: true })
  neckDiameterCm: number | null;

  @Column({ type: 'varchar', length: 12 })
  shape: PotShape;

  @Column({ name: 'clay_body', type: 'varchar', length: 16, default: 'unknown' })
  clayBody: ClayBody;

  @Column({ type: 'varchar', length: 20 })
  make: PotMake;

  @Column({ name: 'firing_cone', type: 'varchar', length: 4, nullable: true })
  firingCone: string | null;

  @Column({ name: 'installed_on', type: 'date', nullable: true })
  installedOn: string | null;

  @Index('pots_plot_idx')
  @Column({ name: 'plot_id', type: 'uuid', nullable: true })
  plotId: string | null;

  @ManyToOne(() => PlotEntity, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'plot_id' })
  plot: Relation<PlotEntity> | null;

  @Column({ type: 'varchar', length: 10, default: 'sound' })
  condition: PotCondition;

  @Column({ type: 'text', default: '' })
  notes: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
