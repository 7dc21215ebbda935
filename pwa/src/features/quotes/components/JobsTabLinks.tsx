import { addOutline, calendarOutline, documentTextOutline } from 'ionicons/icons';
import { Link } from 'react-router-dom';
import { useCurrentUser } from '../../auth/hooks/useCurrentUser';
import '../quotes.css';
import { Icon } from '../../../components/Icon';

/** Above the jobs list: New quote and the quotes (the owner's), and the calendar (everyone's). */
export function JobsTabLinks() {
  const user = useCurrentUser();
  const owner = user?.role === 'owner';
  return (
    <nav className="pp-quotes__top" aria-label="Quotes and calendar">
      {owner ? (
        <Link className="pp-button" to="/jobs/quotes/new">
          <Icon icon={addOutline} />
          <span>New quote</span>
        </Link>
      ) : null}
      {owner ? (
        <Link className="pp-link" to="/jobs/quotes">
          <Icon icon={documentTextOutline} />
          <span>Quotes</span>
        </Link>
      ) : null}
      <Link className="pp-link" to="/jobs/calendar">
        <Icon icon={calendarOutline} />
        <span>{owner ? 'Calendar' : 'My calendar'}</span>
      </Link>
    </nav>
  );
}
