import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import { Business } from '../businesses/business.entity';

export const ROLES = ['owner', 'tech', 'customer'] as const;
export type Role = (typeof ROLES)[number];

/** A person who signs in: the owner, a helper (`tech`), or a customer through an e-mailed link. */
@Entity('users')
@Index('users_email_key', ['email'], { unique: true })
@Index('users_business_idx', ['businessId'])
@Check('users_role_check', `"role" IN ('owner', 'tech', 'customer')`)
export class User {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid' })
  businessId: string;

  @ManyToOne(() => Business, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'business_id', foreignKeyConstraintName: 'FK_users_business' })
  business?: Business;

  /** Stored lower-cased. */
  @Column({ type: 'text' })
  email: string;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text' })
  role: Role;

  /** For the `customer` role: the customer record this person is. */
  @Column({ type: 'uuid', nullable: true })
  customerId: string | null;

  /** argon2id; null for customers, who sign in by link. */
  @Column({ type: 'text', nullable: true })
  passwordHash: string | null;

  /**
   * Bumped when what this person may see changes (a helper given or taken off a job), so
   * their devices start their next pull from scratch.
   */
  @Column({ type: 'integer', default: 0 })
  scopeEpoch: number;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz' })
  updatedAt: Date;

  @Column({ type: 'timestamptz', nullable: true })
  deletedAt: Date | null;
}
