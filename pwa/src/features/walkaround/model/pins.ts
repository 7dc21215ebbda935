/** The kinds of damage a pin marks (the server's list) and the words for them. */
export const PIN_KINDS = [
  'chip',
  'scratch',
  'dent',
  'etching',
  'lifting-vinyl',
  'repaint',
  'other',
] as const;
export type PinKind = (typeof PIN_KINDS)[number];

export const PIN_KIND_WORDS: Record<PinKind, string> = {
  chip: 'Chip',
  scratch: 'Scratch',
  dent: 'Dent',
  etching: 'Etching',
  'lifting-vinyl': 'Lifting vinyl',
  repaint: 'Repaint',
  other: 'Other',
};

export function pinKindWords(kind: string): string {
  return (PIN_KIND_WORDS as Record<string, string>)[kind] ?? kind;
}

/** 1 minor, 2 noticeable, 3 serious (the server's scale). */
export const SEVERITIES = [1, 2, 3] as const;
export type Severity = (typeof SEVERITIES)[number];

export const SEVERITY_WORDS: Record<Severity, string> = {
  1: 'Minor',
  2: 'Noticeable',
  3: 'Serious',
};

export function severityWords(severity: number): string {
  return (SEVERITY_WORDS as Record<number, string>)[severity] ?? `Severity ${severity}`;
}
