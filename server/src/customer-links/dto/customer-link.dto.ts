import { IsUUID } from 'class-validator';

/** `customer.sendLink` (owner): e-mails the customer a single-use sign-in link. */
export class SendCustomerLinkDto {
  @IsUUID()
  customerId: string;
}

export class CustomerLinkDto {
  id: string;
  customerId: string;
  /** The address the link was sent to. */
  sentTo: string;
  expiresAt: Date;
  /** The link itself (`<PUBLIC_URL>/c/<token>`), to pass on another way if the e-mail is lost. */
  link: string;
  /** The outbox row of the e-mail. */
  mailId: string;
}
