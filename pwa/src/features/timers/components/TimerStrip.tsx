import type { TimerRow } from '@panelpass/shared';
import {
  KIND_WORDS,
  kindOf,
  remainingSpoken,
  remainingText,
  timerState,
} from '../model/timerWords';
import { KIND_ICONS } from './kindLook';
import { Icon } from '../../../components/Icon';

/**
 * The strip above the tab bar while a timer runs: the nearest one's kind (word and icon),
 * what it is for and the time left in big figures, and how many more run. Tap for all.
 */
export function TimerStrip({
  nearest,
  more,
  nowMs,
  onOpen,
}: {
  nearest: TimerRow;
  more: number;
  nowMs: number;
  onOpen: () => void;
}) {
  const kind = kindOf(nearest);
  const paused = timerState(nearest, nowMs) === 'paused';
  return (
    <button
      type="button"
      className={`pp-strip${paused ? ' pp-strip--paused' : ''}`}
      aria-haspopup="dialog"
      onClick={onOpen}
    >
      <span className="pp-strip__kind">
        <Icon icon={KIND_ICONS[kind]} />
        <span>{paused ? `${KIND_WORDS[kind]} · paused` : KIND_WORDS[kind]}</span>
      </span>
      <span className="pp-strip__label">{nearest.label || KIND_WORDS[kind]}</span>
      <span className="pp-strip__time" aria-hidden="true">
        {remainingText(nearest, nowMs)}
      </span>
      <span className="pp-timer__spoken">, {remainingSpoken(nearest, nowMs)}</span>
      {more ? <span className="pp-strip__more">+{more} more</span> : null}
      <span className="pp-timer__spoken">. Show all timers.</span>
    </button>
  );
}
