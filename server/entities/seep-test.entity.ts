import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import type { SeepSetting } from '@shared/schemas/pots';
import { PotEntity } from './pot.entity';

/** Litres a pot lost over a measured time under stated conditions. */
@Entity('seep_tests')
export class SeepTestEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index('seep_tests_pot_idx')
  @Column({ name: 'pot_id', type: 'uuid' })
  potId: string;

  @ManyToOne(() => PotEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'pot_id' })
  pot: Relation<PotEntity>;

  @Column({ name: 'tested_on', type: 'date' })
  testedOn: string;

  @Column({ type: 'varchar', length: 16 })
  setting: SeepSetting;

  @Column({ name: 'litres_lost', type: 'double precision' })
  litresLost: number;

  @Column({ type: 'double precision' })
  hours: number;

  @Column({ type: 'text', default: '' })
  notes: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
