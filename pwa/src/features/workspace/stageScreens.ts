import { lazy, type ComponentType, type LazyExoticComponent } from 'react';
import type { JobStage } from '@panelpass/shared';

/** What every stage screen of the job workspace is given. */
export interface StageScreenProps {
  jobId: string;
}

type Screen = LazyExoticComponent<ComponentType<StageScreenProps>>;

/**
 * The screen of each stage, loaded when first opened. Each lives in its own feature folder;
 * `booked` and `closed` show the job's summary (the workspace page itself).
 */
export const stageScreens: Partial<Record<JobStage, Screen>> = {
  walkaround: lazy(() => import('../walkaround/WalkaroundStage')),
  prep: lazy(() => import('../prep/PrepStage')),
  correction: lazy(() => import('../correction/CorrectionStage')),
  finish: lazy(() => import('../finish/FinishStage')),
  handover: lazy(() => import('../handover/HandoverStage')),
};

/** Chips are worked on beside the stages (during prep and correction), on a tab of their own. */
export const ChipsScreen: Screen = lazy(() => import('../chips/ChipsStage'));
