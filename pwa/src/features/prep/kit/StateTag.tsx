import {
  alertCircle,
  checkmarkCircle,
  ellipseOutline,
  hourglassOutline,
  informationCircleOutline,
  removeCircleOutline,
} from 'ionicons/icons';
import { Icon } from '../../../components/Icon';

/** The tones of a state: never colour alone, each has its own icon shape and a word. */
export type Tone = 'go' | 'wait' | 'stop' | 'done' | 'quiet' | 'info';

export const toneIcon: Record<Tone, string> = {
  go: ellipseOutline,
  wait: hourglassOutline,
  stop: alertCircle,
  done: checkmarkCircle,
  quiet: removeCircleOutline,
  info: informationCircleOutline,
};

/** A state in a word and an icon: "Overdue", "Done", "Working". */
export function StateTag({ tone, words, icon }: { tone: Tone; words: string; icon?: string }) {
  return (
    <span className={`pp-tag pp-tag--${tone}`}>
      <Icon icon={icon ?? toneIcon[tone]} />
      <span>{words}</span>
    </span>
  );
}
