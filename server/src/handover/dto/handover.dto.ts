import { IsUUID } from 'class-validator';

/** `job.sendReport` (owner): e-mail the job report again, and the receipt when invoiced. */
export class SendReportDto {
  @IsUUID()
  id: string;
}

export class SentMailDto {
  /** The outbox rows queued (delivered within seconds while the mail server answers). */
  queued: string[];
  to: string;
}
