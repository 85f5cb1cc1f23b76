import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import { ObservationEntity } from './observation.entity';

/** A photo in object storage, attached to an observation. */
@Entity('photos')
export class PhotoEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index('photos_observation_idx')
  @Column({ name: 'observation_id', type: 'uuid' })
  observationId: string;

  @ManyToOne(() => ObservationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'observation_id' })
  observation: Relation<ObservationEntity>;

  @Column({ name: 'storage_key', type: 'varchar', length: 200 })
  storageKey: string;

  @Column({ name: 'content_type', type: 'varchar', length: 40 })
  contentType: string;

  @Column({ type: 'integer' })
  bytes: number;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
