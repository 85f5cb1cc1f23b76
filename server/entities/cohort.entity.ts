import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, type Relation } from 'typeorm';
import { UserEntity } from './user.entity';

/** A county programme, a class or a garden network, led by an educator. */
@Entity('cohorts')
export class CohortEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'varchar', length: 120 })
  name: string;

  @Column({ type: 'text', default: '' })
  description: string;

  @Column({ type: 'varchar', length: 16, default: 'programme' })
  kind: 'programme' | 'class' | 'network';

  @Index('cohorts_lead_idx')
  @Column({ name: 'lead_id', type: 'uuid' })
  leadId: string;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'lead_id' })
  lead: Relation<UserEntity>;

  @Index('cohorts_join_code_key', { unique: true })
  @Column({ name: 'join_code', type: 'varchar', length: 16 })
  joinCode: string;

  /** Most members allowed (null: no limit). */
  @Column({ type: 'integer', nullable: true })
  capacity: number | null;

  @Column({ name: 'closed_at', type: 'timestamptz', nullable: true })
  closedAt: Date | null;

  /** Licence for exported data and reports. */
  @Column({ type: 'varchar', length: 32, default: 'CC-BY-4.0' })
  licence: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
