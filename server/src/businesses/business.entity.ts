import {
  Column,
  CreateDateColumn,
  Entity,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import type { JsonObject } from '../database/synced.entity';

/** One detailing business; every other record carries its id. */
@Entity('businesses')
export class Business {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  name: string;

  /** Prices, factors, tax, travel bands, units and default waits (see settings.dto.ts). */
  @Column({ type: 'jsonb', default: () => "'{}'" })
  settings: JsonObject;

  /** IANA time zone the business works in (for "today" and reminders). */
  @Column({ type: 'text', default: 'UTC' })
  timezone: string;

  @Column({ type: 'text', default: 'USD' })
  currency: string;

  /** The next invoice number; taken under a row lock so numbers have no gaps. */
  @Column({ type: 'integer', default: 1 })
  nextInvoiceNumber: number;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz' })
  updatedAt: Date;
}
