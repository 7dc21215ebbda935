import { Link } from 'react-router-dom';
import { TodayScreen } from '../features/today/components/TodayScreen';
import { TabPage } from '../features/shell/components/TabPage';

/** Today: what needs doing, the timers running and the day's visits in order. */
export default function TodayPage() {
  return (
    <TabPage title="Today">
      <TodayScreen />
      <Link className="pp-link" to="/jobs/calendar">
        The week in the calendar
      </Link>
    </TabPage>
  );
}
