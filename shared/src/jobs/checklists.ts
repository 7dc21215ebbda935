import type { JobStage } from './stages';

export interface ChecklistTemplateItem {
  stage: JobStage;
  key: string;
  label: string;
}

/** The default steps a new job starts with; the detailer ticks them off in the field. */
export const DEFAULT_CHECKLIST: readonly ChecklistTemplateItem[] = [
  { stage: 'prep', key: 'prep.rinse-wash', label: 'Rinsed and contact-washed top down' },
  { stage: 'prep', key: 'prep.iron', label: 'Iron fallout remover applied and rinsed off' },
  { stage: 'prep', key: 'prep.tar-sap', label: 'Tar, sap and bug spots treated and flushed' },
  { stage: 'prep', key: 'prep.clay', label: 'Clayed where the paint still felt rough' },
  { stage: 'prep', key: 'prep.dry', label: 'Dried, gaps blown out' },
  { stage: 'prep', key: 'prep.mask', label: 'Textured trim, vinyl edges and emblems masked' },
  { stage: 'prep', key: 'prep.wheels', label: 'Wheels and tyres covered' },
  { stage: 'finish', key: 'finish.unmask', label: 'All masking removed' },
  { stage: 'finish', key: 'finish.wipe', label: 'Panels wiped clean of polishing oils' },
  {
    stage: 'finish',
    key: 'finish.inspect',
    label: 'Every panel checked under the inspection light',
  },
  { stage: 'finish', key: 'finish.residue', label: 'Residue cleared from trim, badges and gaps' },
  { stage: 'finish', key: 'finish.photos', label: 'After photos taken' },
];
