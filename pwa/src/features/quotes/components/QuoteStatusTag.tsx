import {
  checkmarkCircleOutline,
  closeCircleOutline,
  createOutline,
  paperPlaneOutline,
} from 'ionicons/icons';
import { STATUS_WORDS, type QuoteStatus } from '../model/quoteStatus';
import { Icon } from '../../../components/Icon';

const ICONS: Record<QuoteStatus, string> = {
  draft: createOutline,
  sent: paperPlaneOutline,
  accepted: checkmarkCircleOutline,
  declined: closeCircleOutline,
};

/** A quote's status: an icon and its word, never colour alone. */
export function QuoteStatusTag({ status }: { status: QuoteStatus }) {
  return (
    <span className={`pp-quote-tag pp-quote-tag--${status}`}>
      <Icon icon={ICONS[status]} />
      <span>
        <span className="pp-quotes-hidden">Status: </span>
        {STATUS_WORDS[status].short}
      </span>
    </span>
  );
}
