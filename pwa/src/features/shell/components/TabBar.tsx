import { NavContext, type RouteAction } from '@ionic/react';
import {
  calendarClearOutline,
  clipboardOutline,
  fileTrayStackedOutline,
  peopleOutline,
  walletOutline,
} from 'ionicons/icons';
import { useContext, useState, type MouseEvent } from 'react';
import { Icon } from '../../../components/Icon';
import { within, type TabDefinition, type TabId } from '../model/access';

const icons: Record<TabId, string> = {
  today: calendarClearOutline,
  jobs: clipboardOutline,
  clients: peopleOutline,
  shelf: fileTrayStackedOutline,
  ledger: walletOutline,
};

/** A tap the browser should handle itself: opening the link in a new tab or window. */
function opensElsewhere(e: MouseEvent): boolean {
  return e.button !== 0 || e.metaKey || e.ctrlKey || e.shiftKey || e.altKey;
}

interface TabMemory {
  /** The tab last shown. */
  tab?: TabId;
  /** Each tab's last address. */
  last: Partial<Record<TabId, string>>;
}

function remember(
  memory: TabMemory | undefined,
  active: TabDefinition | undefined,
  here: string,
  action: RouteAction | undefined,
): TabMemory {
  if (!active) return memory ?? { last: {} };
  const last = { ...memory?.last, [active.id]: here };
  // Gone back (the back button) from one tab to another: the tab left starts again at its first
  // page next time, as Ionic's own bar does.
  if (action === 'pop' && memory?.tab && memory.tab !== active.id) delete last[memory.tab];
  return { tab: active.id, last };
}

/**
 * The bottom tab bar: a landmark of plain links, one per tab, placed in `ion-tabs`' bottom slot.
 * Each tab keeps its own place: tapping another tab returns to the page last seen on it (a job
 * opened from Jobs), tapping the current tab goes back to its first page. That history is kept
 * by Ionic's router, told through its NavContext as its own tab bar tells it (`setCurrentTab`,
 * `changeTab`, `resetTab`); this bar only remembers each tab's last address.
 *
 * Our own rather than IonTabBar/IonTabButton: those are six custom elements to define, connect
 * and draw at every start, and IonTabBar sets its state again once mounted, which makes React
 * render again synchronously inside the first screen's commit (measured: Lighthouse's Total
 * Blocking Time on Today, docs/benchmarks.md).
 */
export function TabBar({ tabs, slot }: { tabs: readonly TabDefinition[]; slot?: 'bottom' }) {
  const nav = useContext(NavContext);
  const route = nav.routeInfo ?? { pathname: window.location.pathname, search: '' };
  const here = route.pathname + (route.search || '');
  const active = tabs.find((tab) => within(route.pathname, tab.path));
  const action = nav.routeInfo?.routeAction;

  // Ionic's router files each new page under the current tab: it must know the tab before the
  // router handles the next navigation, so it is told at every render, as IonTabBar tells it
  // (from getDerivedStateFromProps). Telling it again is harmless.
  if (active && nav.routeInfo) nav.setCurrentTab(active.id, nav.routeInfo);

  // Where each tab was last, for a tap coming back to it; kept up during render (React's way
  // to follow a prop), so it costs no second render of the bar, none at all at the start.
  const [memory, setMemory] = useState(() => remember(undefined, active, here, action));
  if (active && (memory.tab !== active.id || memory.last[active.id] !== here)) {
    setMemory(remember(memory, active, here, action));
  }

  const hrefOf = (tab: TabDefinition) =>
    tab.id === active?.id ? here : (memory.last[tab.id] ?? tab.path);

  const onTap = (e: MouseEvent<HTMLAnchorElement>, tab: TabDefinition) => {
    if (opensElsewhere(e)) return;
    e.preventDefault();
    if (tab.id !== active?.id) nav.changeTab(tab.id, hrefOf(tab));
    else if (here !== tab.path) nav.resetTab(tab.id, tab.path);
  };

  // No tabs (the session just ended): no empty landmark either.
  if (!tabs.length) return null;
  return (
    <nav className="pp-tabbar" slot={slot} aria-label="Sections">
      {tabs.map((tab) => (
        <a
          key={tab.id}
          className="pp-tab"
          href={hrefOf(tab)}
          aria-current={tab.id === active?.id ? 'page' : undefined}
          onClick={(e) => onTap(e, tab)}
        >
          <Icon icon={icons[tab.id]} />
          <span className="pp-tab-label">{tab.label}</span>
        </a>
      ))}
    </nav>
  );
}
