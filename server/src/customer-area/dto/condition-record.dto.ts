/** The job the record is of. */
export class ConditionJobDto {
  id: string;
  stage: string;
  windowStart: Date;
  windowEnd: Date;
  address: string;
  conditionNotes: string;
}

export class ConditionVehicleDto {
  /** "dark green 2016 Tessaly Longroof", or the body style when nothing else is known. */
  label: string;
  /** The body style of the outline the pins were placed on. */
  bodyStyle: string;
  plate: string;
}

/** A damage pin, placed as fractions (0..1) of the vehicle outline's width and height. */
export class ConditionPinDto {
  id: string;
  number: number;
  x: number;
  y: number;
  panelKey: string | null;
  /** The panel's name on this job ("Hood"), or null when the pin is on no panel. */
  panelLabel: string | null;
  kind: string;
  /** 1 to 3. */
  severity: number;
  note: string;
  /** The pin's photo, if one was taken (GET /api/blobs/:sha256). */
  photoSha256: string | null;
}

/** Film readings of one panel: the mean of the valid gauge readings of each phase (µm). */
export class ConditionPanelDto {
  id: string;
  panelKey: string;
  label: string;
  beforeUm: number | null;
  afterUm: number | null;
  /** before − after, never below 0; null unless both were measured. */
  removedUm: number | null;
  /** Shared flagPanels against the vehicle's own baseline: thin, probably-repainted, probably-filled. */
  flags: string[];
}

export class ConditionPhotoDto {
  id: string;
  /** before, after, damage or other. */
  kind: string;
  caption: string;
  sha256: string;
  takenAt: Date;
  /** GET it with the same sign-in. */
  url: string;
}

/** A condition signature: who signed, when, and the SHA-256 of exactly the record they saw. */
export class ConditionSignatureDto {
  id: string;
  signerName: string;
  signedAt: Date;
  recordHash: string;
  imageSha256: string;
  imageUrl: string;
  /** The record as signed (its canonical JSON hashes to recordHash). */
  record: Record<string, unknown>;
}

/**
 * `GET /api/jobs/:id/condition-record`: the walkaround as found on arrival — notes, pins on the
 * outline, photos, film readings per panel before and after, and the condition signatures.
 */
export class ConditionRecordDto {
  job: ConditionJobDto;
  vehicle: ConditionVehicleDto;
  businessName: string;
  timezone: string;
  /** The business's unit for film thickness ("um" or "mil"); values are always µm. */
  thicknessUnit: string;
  pins: ConditionPinDto[];
  panels: ConditionPanelDto[];
  photos: ConditionPhotoDto[];
  signatures: ConditionSignatureDto[];
}
