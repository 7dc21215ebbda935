import {
  calendarOutline,
  colorWandOutline,
  footstepsOutline,
  handRightOutline,
  lockClosedOutline,
  shieldCheckmarkOutline,
  waterOutline,
} from 'ionicons/icons';
import type { JobStage } from '@panelpass/shared';

/** One icon shape per stage, always shown beside the stage's word (STAGE_LABELS). */
export const STAGE_ICONS: Record<JobStage, string> = {
  booked: calendarOutline,
  walkaround: footstepsOutline,
  prep: waterOutline,
  correction: colorWandOutline,
  finish: shieldCheckmarkOutline,
  handover: handRightOutline,
  closed: lockClosedOutline,
};
