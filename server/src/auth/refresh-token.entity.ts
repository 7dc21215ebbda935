import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryColumn,
} from 'typeorm';
import { User } from '../users/user.entity';

/**
 * One rotating refresh token. Tokens of one sign-in share a family; presenting a token
 * that was already used revokes the whole family (a stolen copy is worth nothing).
 */
@Entity('refresh_tokens')
@Index('refresh_tokens_family_idx', ['familyId'])
export class RefreshToken {
  @PrimaryColumn('uuid')
  id: string;

  @Column({ type: 'uuid' })
  familyId: string;

  @Column({ type: 'uuid' })
  userId: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'FK_refresh_tokens_user' })
  user?: User;

  /** SHA-256 of the secret part; the secret itself is never stored. */
  @Column({ type: 'text' })
  secretHash: string;

  @Column({ type: 'timestamptz' })
  expiresAt: Date;

  @Column({ type: 'timestamptz', nullable: true })
  usedAt: Date | null;

  @Column({ type: 'timestamptz', nullable: true })
  revokedAt: Date | null;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;
}
