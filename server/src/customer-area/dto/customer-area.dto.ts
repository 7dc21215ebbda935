/** The business a customer deals with: its name, and how its amounts and times are shown. */
export class CustomerBusinessDto {
  name: string;
  /** ISO 4217 code; every amount the customer sees is in minor units of it. */
  currency: string;
  /** IANA zone name the visits are booked in. */
  timezone: string;
}

export class CustomerSelfDto {
  id: string;
  name: string;
}

/** `GET /api/customer-area`: who the customer is and whose customer they are. */
export class CustomerAreaDto {
  customer: CustomerSelfDto;
  business: CustomerBusinessDto;
}

/** A signature image stored for a quote signature (then named in `signature.capture`). */
export class SignatureImageDto {
  sha256: string;
  mime: string;
  bytes: number;
}
