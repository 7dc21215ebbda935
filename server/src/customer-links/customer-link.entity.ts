import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
} from 'typeorm';
import { Business } from '../businesses/business.entity';
import { Customer } from '../customers/customer.entity';

/**
 * A sign-in link e-mailed to a customer: single use, short-lived. Only the SHA-256 of its
 * token is kept, so the table alone cannot sign anyone in.
 */
@Entity('customer_links')
@Index('customer_links_token_hash_key', ['tokenHash'], { unique: true })
@Index('customer_links_customer_idx', ['customerId'])
export class CustomerLink {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid' })
  businessId: string;

  @ManyToOne(() => Business, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'business_id', foreignKeyConstraintName: 'FK_customer_links_business' })
  business?: Business;

  @Column({ type: 'uuid' })
  customerId: string;

  @ManyToOne(() => Customer, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'customer_id', foreignKeyConstraintName: 'FK_customer_links_customer' })
  customer?: Customer;

  @Column({ type: 'text' })
  tokenHash: string;

  /** The address it was sent to. */
  @Column({ type: 'text' })
  sentTo: string;

  @Column({ type: 'uuid' })
  createdBy: string;

  @Column({ type: 'timestamptz' })
  expiresAt: Date;

  @Column({ type: 'timestamptz', nullable: true })
  usedAt: Date | null;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;
}
