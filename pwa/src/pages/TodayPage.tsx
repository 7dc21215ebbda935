import { TodayScreen } from '../features/today/components/TodayScreen';
import { TabPage } from '../features/shell/components/TabPage';

/** Today: what needs doing, the timers running and the day's visits in order. */
export default function TodayPage() {
  return (
    <TabPage title="Today">
      <TodayScreen />
    </TabPage>
  );
}
