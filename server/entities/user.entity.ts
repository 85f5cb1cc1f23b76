import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';

@Entity('users')
export class UserEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  /** Stored lower-cased and trimmed. */
  @Index('users_email_key', { unique: true })
  @Column({ type: 'varchar', length: 254 })
  email: string;

  @Column({ name: 'password_hash', type: 'varchar', length: 100 })
  passwordHash: string;

  @Column({ name: 'display_name', type: 'varchar', length: 80 })
  displayName: string;

  @Column({ type: 'varchar', length: 16, default: 'grower' })
  role: 'grower' | 'educator' | 'admin';

  @Column({ name: 'unit_system', type: 'varchar', length: 8, default: 'metric' })
  unitSystem: 'metric' | 'us';

  @Column({ type: 'varchar', length: 8, default: 'en' })
  language: 'en' | 'es';

  @Column({ name: 'email_verified_at', type: 'timestamptz', nullable: true })
  emailVerifiedAt: Date | null;

  @Column({ name: 'disabled_at', type: 'timestamptz', nullable: true })
  disabledAt: Date | null;

  /** Sessions issued before this moment are no longer valid. */
  @Column({ name: 'sessions_valid_after', type: 'timestamptz', default: () => 'now()' })
  sessionsValidAfter: Date;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
