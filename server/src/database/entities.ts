import { AuditEntry } from '../audit/audit-entry.entity';
import { RefreshToken } from '../auth/refresh-token.entity';
import { Business } from '../businesses/business.entity';
import { ChecklistItem } from '../checklist/checklist-item.entity';
import { ChipLayer } from '../chips/chip-layer.entity';
import { Chip } from '../chips/chip.entity';
import { ClimateReading } from '../climate/climate-reading.entity';
import { Customer } from '../customers/customer.entity';
import { FollowUp } from '../follow-ups/follow-up.entity';
import { CustomerLink } from '../customer-links/customer-link.entity';
import { Invite } from '../invites/invite.entity';
import { Invoice } from '../invoices/invoice.entity';
import { Job } from '../jobs/job.entity';
import { OutboundMail } from '../mail/outbound-mail.entity';
import { MaskingItem } from '../masking/masking-item.entity';
import { JobPanel } from '../panels/job-panel.entity';
import { CorrectionPass } from '../passes/correction-pass.entity';
import { Payment } from '../payments/payment.entity';
import { PaymentEvent } from '../payments/payment-event.entity';
import { StoredBlob } from '../photos/blob.entity';
import { Photo } from '../photos/photo.entity';
import { DamagePin } from '../pins/damage-pin.entity';
import { Product } from '../products/product.entity';
import { StockMovement } from '../products/stock-movement.entity';
import { QuoteLine } from '../quotes/quote-line.entity';
import { Quote } from '../quotes/quote.entity';
import { FilmReading } from '../readings/film-reading.entity';
import { Signature } from '../signatures/signature.entity';
import { SolventApplication } from '../solvents/solvent-application.entity';
import { Timer } from '../timers/timer.entity';
import { SyncClient } from '../sync/sync-client.entity';
import { SyncRejection } from '../sync/sync-rejection.entity';
import { User } from '../users/user.entity';
import { Vehicle } from '../vehicles/vehicle.entity';

/** Every entity, listed once: the app module, the CLI data source and the tests use this. */
export const entities = [
  AuditEntry,
  RefreshToken,
  Business,
  ChecklistItem,
  ChipLayer,
  Chip,
  ClimateReading,
  Customer,
  Invite,
  Invoice,
  Job,
  MaskingItem,
  JobPanel,
  CorrectionPass,
  Payment,
  StoredBlob,
  Photo,
  DamagePin,
  Product,
  StockMovement,
  QuoteLine,
  Quote,
  FilmReading,
  Signature,
  SolventApplication,
  Timer,
  SyncClient,
  SyncRejection,
  User,
  Vehicle,
  OutboundMail,
  CustomerLink,
  PaymentEvent,
  FollowUp,
];
