import type { TimerKind } from './timerWords';

/** One beep: pitch (Hz), how long it sounds, and the silence after it (ms). */
export interface Beep {
  hz: number;
  ms: number;
  gapMs: number;
}

/**
 * A short pattern per kind, so the detailer knows which wait is over without looking:
 * flush — three quick high beeps (it is urgent); dwell — two even beeps; cure — a rising
 * pair; keep-dry — one long low and one short; any other timer — one long beep. Each is
 * played twice. Vibration follows the same rhythm.
 */
export const ALARM_PATTERNS: Record<TimerKind, readonly Beep[]> = {
  flush: [
    { hz: 1320, ms: 120, gapMs: 80 },
    { hz: 1320, ms: 120, gapMs: 80 },
    { hz: 1320, ms: 120, gapMs: 300 },
  ],
  dwell: [
    { hz: 990, ms: 220, gapMs: 120 },
    { hz: 990, ms: 220, gapMs: 300 },
  ],
  cure: [
    { hz: 660, ms: 260, gapMs: 60 },
    { hz: 880, ms: 360, gapMs: 300 },
  ],
  'keep-dry': [
    { hz: 520, ms: 450, gapMs: 120 },
    { hz: 520, ms: 150, gapMs: 300 },
  ],
  custom: [{ hz: 880, ms: 600, gapMs: 300 }],
};

const REPEATS = 2;

/** The vibration pattern (on, off, on…) matching a kind's beeps, played twice. */
export function vibrationPattern(kind: TimerKind): number[] {
  const once = ALARM_PATTERNS[kind].flatMap((b) => [b.ms, b.gapMs]);
  const twice = Array.from({ length: REPEATS }, () => once).flat();
  twice.pop(); // no trailing pause
  return twice;
}

type AudioContextClass = typeof AudioContext;

let context: AudioContext | null = null;

function audioContext(): AudioContext | null {
  if (context) return context;
  const Ctor: AudioContextClass | undefined =
    typeof window === 'undefined'
      ? undefined
      : (window.AudioContext ??
        (window as unknown as { webkitAudioContext?: AudioContextClass }).webkitAudioContext);
  if (!Ctor) return null;
  try {
    context = new Ctor();
  } catch {
    return null;
  }
  return context;
}

/**
 * Browsers only let a page make sound after the person has touched it. The first tap or key
 * anywhere in the app wakes the audio, so a later alarm can sound without a tap.
 */
export function primeAlarmSoundOnFirstTouch(): () => void {
  const wake = () => {
    const ctx = audioContext();
    if (ctx && ctx.state === 'suspended') void ctx.resume().catch(() => undefined);
  };
  const options = { capture: true, passive: true } as const;
  window.addEventListener('pointerdown', wake, options);
  window.addEventListener('keydown', wake, options);
  return () => {
    window.removeEventListener('pointerdown', wake, options);
    window.removeEventListener('keydown', wake, options);
  };
}

/**
 * Plays the kind's pattern with the Web Audio API (square-ish tones cut through outdoor
 * noise; no audio files). Answers false when the browser gives no sound (no audio, or not
 * yet allowed): the banner and vibration still show the alarm.
 */
export function playAlarm(kind: TimerKind): boolean {
  const ctx = audioContext();
  if (!ctx) return false;
  if (ctx.state === 'suspended') void ctx.resume().catch(() => undefined);
  if (ctx.state !== 'running' && ctx.state !== 'suspended') return false;
  let t = ctx.currentTime + 0.05;
  for (let r = 0; r < REPEATS; r += 1) {
    for (const beep of ALARM_PATTERNS[kind]) {
      const osc = ctx.createOscillator();
      const gain = ctx.createGain();
      osc.type = 'square';
      osc.frequency.setValueAtTime(beep.hz, t);
      // Short ramps, so each beep starts and stops without a click.
      gain.gain.setValueAtTime(0.0001, t);
      gain.gain.exponentialRampToValueAtTime(0.35, t + 0.01);
      gain.gain.setValueAtTime(0.35, t + beep.ms / 1000 - 0.02);
      gain.gain.exponentialRampToValueAtTime(0.0001, t + beep.ms / 1000);
      osc.connect(gain).connect(ctx.destination);
      osc.start(t);
      osc.stop(t + beep.ms / 1000 + 0.01);
      t += (beep.ms + beep.gapMs) / 1000;
    }
  }
  return ctx.state === 'running';
}

/** Vibrates in the kind's rhythm where the phone can (not on iPhones). */
export function vibrateAlarm(kind: TimerKind): boolean {
  try {
    return typeof navigator.vibrate === 'function' && navigator.vibrate(vibrationPattern(kind));
  } catch {
    return false;
  }
}
