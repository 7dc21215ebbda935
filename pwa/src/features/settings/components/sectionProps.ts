import type { BusinessDraft, Problems } from '../model/businessForm';

/** What each part of the Settings form is given: the draft, a way to change it, its problems. */
export interface SectionProps {
  draft: BusinessDraft;
  change: (change: Partial<BusinessDraft>) => void;
  problems: Problems;
  currency: string;
}

let made = 0;
/** A key for a row added on this screen (rows from the server are keyed by their id). */
export const newRowKey = (list: string) => `${list}-added-${++made}`;
