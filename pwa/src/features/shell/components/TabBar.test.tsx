import { NavContext, type NavContextState, type RouteInfo } from '@ionic/react';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { tabs, tabsForRole } from '../model/access';
import { TabBar } from './TabBar';

afterEach(cleanup);

/** Ionic's router as the bar sees it: where the app is, and what the bar told it. */
function router(pathname: string) {
  const calls: string[] = [];
  const nav = {
    routeInfo: { id: 'r0', pathname, search: '' } as RouteInfo,
    setCurrentTab: vi.fn((tab: string) => calls.push(`current ${tab}`)),
    changeTab: vi.fn((tab: string, path: string) => calls.push(`change ${tab} ${path}`)),
    resetTab: vi.fn((tab: string, href: string) => calls.push(`reset ${tab} ${href}`)),
  } as unknown as NavContextState;
  const bar = <TabBar tabs={tabsForRole('owner')} />;
  const view = render(<NavContext.Provider value={nav}>{bar}</NavContext.Provider>);
  /** The router moving to another page (a tap, a link, the back button). */
  const go = (to: string, routeAction: RouteInfo['routeAction'] = 'push') => {
    nav.routeInfo = { id: to, pathname: to, search: '', routeAction };
    view.rerender(<NavContext.Provider value={{ ...nav }}>{bar}</NavContext.Provider>);
  };
  return { nav, calls, go };
}

const link = (name: string) => screen.getByRole('link', { name });

describe('TabBar', () => {
  it('is a landmark of links, one per tab the role sees, the current one marked', () => {
    router('/today');
    const bar = screen.getByRole('navigation', { name: 'Sections' });
    const links = Array.from(bar.querySelectorAll('a'));
    expect(links.map((a) => a.textContent)).toEqual([
      'Today',
      'Jobs',
      'Clients',
      'Shelf',
      'Ledger',
    ]);
    expect(links.map((a) => a.getAttribute('href'))).toEqual(tabs.map((t) => t.path));
    expect(link('Today').getAttribute('aria-current')).toBe('page');
    expect(link('Jobs').getAttribute('aria-current')).toBeNull();
  });

  it("tells Ionic's router the current tab once at the start: no second render", () => {
    const { calls } = router('/jobs/42');
    expect(calls).toEqual(['current jobs']);
    expect(link('Jobs').getAttribute('aria-current')).toBe('page');
  });

  it('opens another tab where it was left, and the current tab at its first page', () => {
    const { calls, go } = router('/today');
    fireEvent.click(link('Jobs'));
    expect(calls.at(-1)).toBe('change jobs /jobs');

    go('/jobs');
    go('/jobs/42');
    go('/today');
    expect(link('Jobs').getAttribute('href')).toBe('/jobs/42');
    fireEvent.click(link('Jobs'));
    expect(calls.at(-1)).toBe('change jobs /jobs/42');

    go('/jobs/42');
    calls.length = 0;
    fireEvent.click(link('Jobs'));
    expect(calls).toEqual(['reset jobs /jobs']);

    // On its first page already: nothing to do.
    go('/jobs');
    calls.length = 0;
    fireEvent.click(link('Jobs'));
    expect(calls).toEqual([]);
  });

  it('starts a tab left by the back button again at its first page', () => {
    const { go } = router('/today');
    go('/jobs');
    go('/jobs/42');
    go('/today', 'pop');
    expect(link('Jobs').getAttribute('href')).toBe('/jobs');
  });

  it('keeps its place on a page outside the tabs (Settings)', () => {
    const { go } = router('/clients/7');
    go('/settings');
    expect(link('Clients').getAttribute('href')).toBe('/clients/7');
    expect(screen.queryByRole('link', { current: 'page' })).toBeNull();
  });

  it('leaves a tap that opens a new browser tab to the browser', () => {
    const { nav } = router('/today');
    // Whether the app took each click; then no click leaves the test page.
    const taken: boolean[] = [];
    const seen = (e: Event) => {
      taken.push(e.defaultPrevented);
      e.preventDefault();
    };
    document.addEventListener('click', seen);
    fireEvent.click(link('Jobs'));
    fireEvent.click(link('Clients'), { ctrlKey: true });
    document.removeEventListener('click', seen);
    expect(taken).toEqual([true, false]);
    expect(nav.changeTab).toHaveBeenCalledTimes(1);
  });

  it('draws nothing when there are no tabs to show (the session has ended)', () => {
    const nav = {
      routeInfo: { id: 'r', pathname: '/settings', search: '' },
      setCurrentTab: vi.fn(),
    };
    render(
      <NavContext.Provider value={nav as unknown as NavContextState}>
        <TabBar tabs={[]} />
      </NavContext.Provider>,
    );
    expect(screen.queryByRole('navigation')).toBeNull();
  });
});
