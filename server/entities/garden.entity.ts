import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, type Relation } from 'typeorm';
import type { SoilTexture } from '@shared/schemas/gardens';
import { UserEntity } from './user.entity';

/** A grower's garden. Its location is stored coarsened to 0.1°. */
@Entity('gardens')
export class GardenEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index('gardens_owner_idx')
  @Column({ name: 'owner_id', type: 'uuid' })
  ownerId: string;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'owner_id' })
  owner: Relation<UserEntity>;

  @Column({ type: 'varchar', length: 100 })
  name: string;

  @Column({ name: 'latitude_deg', type: 'double precision' })
  latitudeDeg: number;

  @Column({ name: 'longitude_deg', type: 'double precision' })
  longitudeDeg: number;

  @Column({ name: 'elevation_m', type: 'double precision' })
  elevationM: number;

  @Column({ name: 'soil_texture', type: 'varchar', length: 20 })
  soilTexture: SoilTexture;

  @Column({ type: 'boolean', default: false })
  coastal: boolean;

  @Column({ type: 'text', default: '' })
  notes: string;

  /** IANA time-zone name (e.g. America/Denver): the garden's calendar days and its "today". */
  @Column({ name: 'time_zone', type: 'varchar', length: 64, default: 'UTC' })
  timeZone: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
