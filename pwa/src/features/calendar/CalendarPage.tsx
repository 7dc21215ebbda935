import { SubPage } from '../quotes/components/SubPage';
import { CalendarScreen } from './components/CalendarScreen';
import './calendar.css';

/** `/jobs/calendar`: the bookings by day or week (a helper's own only). */
export default function CalendarPage() {
  return (
    <SubPage title="Calendar" backTo="/jobs" backLabel="Back to the jobs">
      <CalendarScreen />
    </SubPage>
  );
}
