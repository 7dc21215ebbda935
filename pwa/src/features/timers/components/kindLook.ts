import {
  alarmOutline,
  alertCircleOutline,
  hourglassOutline,
  pauseOutline,
  playOutline,
  timerOutline,
  umbrellaOutline,
  waterOutline,
} from 'ionicons/icons';
import type { TimerKind, TimerState } from '../model/timerWords';

/** One icon shape per kind of timer, always beside its word. */
export const KIND_ICONS: Record<TimerKind, string> = {
  cure: hourglassOutline,
  flush: waterOutline,
  dwell: timerOutline,
  'keep-dry': umbrellaOutline,
  custom: alarmOutline,
};

/** What a timer on screen is doing, in a word and an icon (and a tone for the colour). */
export function stateLook(
  state: TimerState,
  missed: boolean,
): { word: string; icon: string; tone: 'wait' | 'stop' | 'go' } {
  if (state === 'ended') {
    return missed
      ? { word: 'Missed alarm', icon: alertCircleOutline, tone: 'stop' }
      : { word: "Time's up", icon: alarmOutline, tone: 'stop' };
  }
  if (state === 'paused') return { word: 'Paused', icon: pauseOutline, tone: 'go' };
  return { word: 'Running', icon: playOutline, tone: 'wait' };
}
