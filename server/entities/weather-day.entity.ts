import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import { GardenEntity } from './garden.entity';
import { UserEntity } from './user.entity';

/** One day's weather at a garden (observed, or a forecast kept apart for frost warnings). */
@Entity('weather_days')
@Index('weather_days_garden_day_key', ['gardenId', 'day', 'forecast'], { unique: true })
export class WeatherDayEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'garden_id', type: 'uuid' })
  gardenId: string;

  @ManyToOne(() => GardenEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'garden_id' })
  garden: Relation<GardenEntity>;

  @Column({ type: 'date' })
  day: string;

  @Column({ type: 'boolean', default: false })
  forecast: boolean;

  @Column({ name: 't_min_c', type: 'double precision' })
  tMinC: number;

  @Column({ name: 't_max_c', type: 'double precision' })
  tMaxC: number;

  @Column({ name: 'rain_mm', type: 'double precision', default: 0 })
  rainMm: number;

  @Column({ name: 'rh_min_pct', type: 'double precision', nullable: true })
  rhMinPct: number | null;

  @Column({ name: 'rh_max_pct', type: 'double precision', nullable: true })
  rhMaxPct: number | null;

  @Column({ name: 'wind_speed_ms', type: 'double precision', nullable: true })
  windSpeedMs: number | null;

  @Column({ name: 'wind_height_m', type: 'double precision', default: 2 })
  windHeightM: number;

  @Column({ name: 'sunshine_hours', type: 'double precision', nullable: true })
  sunshineHours: number | null;

  @Column({ name: 'solar_radiation_mj', type: 'double precision', nullable: true })
  solarRadiationMJ: number | null;

  @Column({ name: 'entered_by', type: 'uuid', nullable: true })
  enteredBy: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'entered_by' })
  enterer: Relation<UserEntity> | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
