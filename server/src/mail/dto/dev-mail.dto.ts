export class DevMailAttachmentDto {
  index: number;
  filename: string;
  contentType: string;
  /** Bytes. */
  size: number;
  sha256: string;
  /** Where to download it (GET, same sign-in). */
  url: string;
}

export class DevMailSummaryDto {
  id: string;
  receivedAt: string;
  from: string;
  to: string;
  subject: string;
  attachments: DevMailAttachmentDto[];
}

export class DevMailDto extends DevMailSummaryDto {
  messageId: string;
  cc: string;
  date: string;
  /** The SMTP envelope: who the relay was told to deliver to. */
  envelope: { from: string | null; to: string[] };
  headers: { name: string; value: string }[];
  text: string | null;
  html: string | null;
}

export class DevMailListDto {
  items: DevMailSummaryDto[];
}
