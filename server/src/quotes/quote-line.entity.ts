import { Column, Entity, Index, JoinColumn, ManyToOne } from 'typeorm';
import { numericNumber, SyncedEntity } from '../database/synced.entity';
import { Quote } from './quote.entity';

/** One priced line of a quote, as computed when the quote was saved. */
@Entity('quote_lines')
@Index('quote_lines_sync_idx', ['businessId', 'version'])
@Index('quote_lines_quote_id_idx', ['quoteId'])
export class QuoteLine extends SyncedEntity {
  @Column({ type: 'uuid' })
  quoteId: string;

  @ManyToOne(() => Quote, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'quote_id', foreignKeyConstraintName: 'FK_quote_lines_quote_id' })
  quote?: Quote;

  @Column({ type: 'integer' })
  position: number;

  @Column({ type: 'text' })
  kind: string;

  @Column({ type: 'text' })
  description: string;

  @Column({ type: 'numeric', precision: 10, scale: 3, default: 1, transformer: numericNumber })
  quantity: number;

  @Column({ type: 'integer' })
  unitPriceMinor: number;

  @Column({ type: 'integer' })
  amountMinor: number;
}
