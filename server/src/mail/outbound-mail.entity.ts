import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryColumn,
  UpdateDateColumn,
} from 'typeorm';
import { Business } from '../businesses/business.entity';

/** A file made when the message is sent (rendered from the database, so never stale or lost). */
export interface MailAttachmentRef {
  /** Which renderer makes it: `invoice-pdf`, `report-pdf`. */
  kind: string;
  /** The record it is made from (the invoice, the job). */
  id: string;
}

export type OutboundMailStatus = 'pending' | 'sent' | 'failed';

/**
 * The outbox of e-mail: a row is written in the same transaction as the change that calls for
 * the message (a job closing, a link asked for), and the sender loop delivers it after the
 * commit, retrying with backoff. Delivered rows are kept as the record of what was sent.
 */
@Entity('outbound_mail')
@Index('outbound_mail_due_idx', ['status', 'nextAttemptAt'])
@Index('outbound_mail_business_idx', ['businessId', 'createdAt'])
export class OutboundMail {
  @PrimaryColumn('uuid')
  id: string;

  @Column({ type: 'uuid' })
  businessId: string;

  @ManyToOne(() => Business, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'business_id', foreignKeyConstraintName: 'FK_outbound_mail_business' })
  business?: Business;

  /** `receipt`, `report`, `customer-link`. */
  @Column({ type: 'text' })
  kind: string;

  /** The job or customer the message is about. */
  @Column({ type: 'uuid', nullable: true })
  subjectId: string | null;

  @Column({ type: 'text' })
  toAddress: string;

  @Column({ type: 'text' })
  subject: string;

  @Column({ type: 'text' })
  text: string;

  @Column({ type: 'text', default: '' })
  html: string;

  @Column({ type: 'jsonb', default: () => "'[]'" })
  attachments: MailAttachmentRef[];

  @Column({ type: 'text', default: 'pending' })
  status: OutboundMailStatus;

  @Column({ type: 'integer', default: 0 })
  attempts: number;

  @Column({ type: 'timestamptz', default: () => 'now()' })
  nextAttemptAt: Date;

  @Column({ type: 'text', nullable: true })
  lastError: string | null;

  /** The Message-ID header, the same on every attempt (a receiver can spot a repeat). */
  @Column({ type: 'text' })
  messageId: string;

  @Column({ type: 'timestamptz', nullable: true })
  sentAt: Date | null;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz' })
  updatedAt: Date;
}
