import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import { UserEntity } from './user.entity';

/** Single-use e-mailed tokens (password reset, e-mail verification), stored hashed. */
@Entity('user_tokens')
export class UserTokenEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index('user_tokens_user_idx')
  @Column({ name: 'user_id', type: 'uuid' })
  userId: string;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user: Relation<UserEntity>;

  @Column({ type: 'varchar', length: 24 })
  purpose: 'password_reset' | 'email_verify';

  @Index('user_tokens_hash_key', { unique: true })
  @Column({ name: 'token_hash', type: 'varchar', length: 64 })
  tokenHash: string;

  @Column({ name: 'expires_at', type: 'timestamptz' })
  expiresAt: Date;

  @Column({ name: 'used_at', type: 'timestamptz', nullable: true })
  usedAt: Date | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
