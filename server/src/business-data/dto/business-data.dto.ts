import { IsIn, IsOptional, IsString, MaxLength } from 'class-validator';

export const EXPORT_FORMATS = ['json', 'csv'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

/** `?format=json` (one JSON document, the default) or `?format=csv` (a zip of CSV files). */
export class ExportQueryDto {
  @IsOptional()
  @IsIn(EXPORT_FORMATS, { message: 'format must be json or csv' })
  format?: ExportFormat = 'json';
}

/** Deleting the business: its name, typed exactly as it is, to show it is meant. */
export class DeleteBusinessDto {
  /** The business's name as the owner typed it (spaces around it are ignored). */
  @IsString()
  @MaxLength(500)
  confirmName: string;
}

/** What was removed, per table. */
export class DeletedBusinessDto {
  businessId: string;
  /** Rows removed per table (tables with none are left out). */
  removed: Record<string, number>;
}
