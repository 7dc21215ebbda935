import { carOutline, chevronBack, chevronForward, warningOutline } from 'ionicons/icons';
import { Fragment, useId, useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import type { DriveSettings } from '@panelpass/shared';
import { EmptyState } from '../../../components/EmptyState';
import { Notice } from '../../../components/Notice';
import { useChanges } from '../../../sync/useChanges';
import { useSession } from '../../auth/hooks/useSession';
import { StageTag } from '../../jobs/components/StageTag';
import { useUnits } from '../../settings/useUnits';
import { useServerNow } from '../../timers/hooks/useServerClock';
import {
  useCalendarBookings,
  useTeamNames,
  type CalendarBooking,
} from '../hooks/useCalendarBookings';
import {
  addDays,
  layoutDay,
  layoutWeek,
  movedWindow,
  placeInDay,
  startOfDay,
  startOfWeek,
  type CalendarDay,
  type Leg,
  type Stop,
} from '../model/calendarLayout';
import { Icon } from '../../../components/Icon';

const time = (ms: number) =>
  new Date(ms).toLocaleTimeString(undefined, { hour: '2-digit', minute: '2-digit' });
const dayTitle = (ms: number) =>
  new Date(ms).toLocaleDateString(undefined, { weekday: 'long', day: 'numeric', month: 'long' });
const shortDay = (ms: number) =>
  new Date(ms).toLocaleDateString(undefined, { weekday: 'short', day: 'numeric', month: 'short' });
const pad = (n: number) => String(n).padStart(2, '0');
const dayInput = (ms: number) => {
  const d = new Date(ms);
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
};
const timeInput = (ms: number) => {
  const d = new Date(ms);
  return `${pad(d.getHours())}:${pad(d.getMinutes())}`;
};

function legWords(leg: Leg): string | null {
  if (!leg) return null;
  if (leg.kind === 'unknown') return 'Drive time unknown: an address has no map position.';
  if (leg.minutes === 0) return 'Same place as the visit before: no drive.';
  return `About ${leg.minutes} min drive from the visit before (${leg.roadKm} km by road).`;
}

/** The owner or the helper changes a visit's day and times (job.update, kept offline). */
function MoveBooking({ booking, onDone }: { booking: CalendarBooking; onDone: () => void }) {
  const { changes } = useChanges();
  const id = useId();
  const [day, setDay] = useState(dayInput(booking.startMs));
  const [from, setFrom] = useState(timeInput(booking.startMs));
  const [to, setTo] = useState(timeInput(booking.endMs));
  const [problem, setProblem] = useState<string | null>(null);

  async function save() {
    const startMs = new Date(`${day}T${from}`).getTime();
    const endMs = new Date(`${day}T${to}`).getTime();
    if (!Number.isFinite(startMs) || !Number.isFinite(endMs)) {
      setProblem('Give the day and both times.');
      return;
    }
    const moved = movedWindow(booking, { startMs, endMs });
    if (!moved) {
      setProblem('The visit must end after it starts.');
      return;
    }
    if (await changes.updateJob({ id: booking.id, ...moved })) onDone();
  }

  return (
    <form
      className="pp-cal__move"
      aria-label={`New time for ${booking.summary.customerName}`}
      onSubmit={(e) => {
        e.preventDefault();
        void save();
      }}
    >
      <label className="pp-cal__small" htmlFor={`${id}-day`}>
        <span>Day</span>
        <input
          id={`${id}-day`}
          className="pp-field__input"
          type="date"
          value={day}
          onChange={(e) => setDay(e.target.value)}
        />
      </label>
      <label className="pp-cal__small" htmlFor={`${id}-from`}>
        <span>Starts</span>
        <input
          id={`${id}-from`}
          className="pp-field__input"
          type="time"
          value={from}
          onChange={(e) => setFrom(e.target.value)}
        />
      </label>
      <label className="pp-cal__small" htmlFor={`${id}-to`}>
        <span>Ends</span>
        <input
          id={`${id}-to`}
          className="pp-field__input"
          type="time"
          value={to}
          onChange={(e) => setTo(e.target.value)}
        />
      </label>
      {problem ? <Notice tone="stop">{problem}</Notice> : null}
      <div className="pp-cal__move-actions">
        <button type="submit" className="pp-button">
          Save the new time
        </button>
        <button type="button" className="pp-link pp-cal__plain" onClick={onDone}>
          Keep the time
        </button>
      </div>
    </form>
  );
}

function StopCard({ stop, canMove }: { stop: Stop<CalendarBooking>; canMove: boolean }) {
  const [moving, setMoving] = useState(false);
  const s = stop.booking.summary;
  return (
    <article
      className={`pp-cal__stop${stop.conflicts.length ? ' pp-cal__stop--conflict' : ''}`}
      aria-label={`${time(stop.booking.startMs)} to ${time(stop.booking.endMs)}, ${s.customerName}`}
    >
      <p className="pp-cal__when">
        {time(stop.booking.startMs)}–{time(stop.booking.endMs)}
      </p>
      <Link className="pp-cal__who" to={`/jobs/${s.job.id}`}>
        {s.customerName} · {s.vehicleName}
      </Link>
      <p className="pp-cal__where">{s.job.address || 'No address'}</p>
      <StageTag stage={s.stage} />
      {stop.conflicts.map((c, i) => (
        <p key={`${c.kind}-${c.withId}-${i}`} className="pp-cal__conflict">
          <Icon icon={warningOutline} />
          <span>
            {c.kind === 'overlap' ? 'Overlap: ' : 'Tight: '}
            {c.words}
          </span>
        </p>
      ))}
      {canMove && s.stage !== 'closed' ? (
        moving ? (
          <MoveBooking booking={stop.booking} onDone={() => setMoving(false)} />
        ) : (
          <button
            type="button"
            className="pp-link pp-cal__plain"
            aria-label={`Move the visit of ${s.customerName}`}
            onClick={() => setMoving(true)}
          >
            Move
          </button>
        )
      ) : null}
    </article>
  );
}

function DayView({
  day,
  canMove,
  routeName,
}: {
  day: CalendarDay<CalendarBooking>;
  canMove: boolean;
  routeName: (who: string | null) => string;
}) {
  if (day.bookings === 0) {
    return (
      <EmptyState title="No visits this day">
        <p>Booked visits show here in order, with the drive between them.</p>
      </EmptyState>
    );
  }
  return (
    <>
      {day.conflicts ? (
        <Notice tone="wait">
          {day.conflicts === 1 ? 'One visit clashes' : `${day.conflicts} visits clash`} with another
          or leaves too little time to drive: see the marks below.
        </Notice>
      ) : null}
      {day.routes.map((route) => (
        <section
          key={route.who ?? 'owner'}
          className="pp-cal__route"
          aria-label={routeName(route.who)}
        >
          {day.routes.length > 1 ? (
            <h3 className="pp-cal__route-title">{routeName(route.who)}</h3>
          ) : null}
          <ol className="pp-cal__stops">
            {route.stops.map((stop) => {
              const leg = legWords(stop.leg);
              return (
                <Fragment key={stop.booking.id}>
                  {leg ? (
                    <li className="pp-cal__leg">
                      <Icon icon={carOutline} />
                      <span>{leg}</span>
                    </li>
                  ) : null}
                  <li>
                    <StopCard stop={stop} canMove={canMove} />
                  </li>
                </Fragment>
              );
            })}
          </ol>
        </section>
      ))}
    </>
  );
}

function WeekView({
  days,
  todayMs,
  onOpenDay,
}: {
  days: CalendarDay<CalendarBooking>[];
  todayMs: number;
  onOpenDay: (dayMs: number) => void;
}) {
  return (
    <ol className="pp-cal__week" aria-label="The week">
      {days.map((day) => {
        const stops = day.routes
          .flatMap((r) => r.stops)
          .sort((a, b) => a.booking.startMs - b.booking.startMs);
        return (
          <li key={day.dayMs} className="pp-cal__weekday">
            <button
              type="button"
              className="pp-cal__day-button"
              aria-current={day.dayMs === todayMs ? 'date' : undefined}
              onClick={() => onOpenDay(day.dayMs)}
            >
              <span className="pp-cal__day-name">{shortDay(day.dayMs)}</span>
              <span>
                {day.bookings === 0
                  ? 'Free'
                  : `${day.bookings} ${day.bookings === 1 ? 'visit' : 'visits'}`}
              </span>
              {day.conflicts ? (
                <span className="pp-cal__day-warn">
                  <Icon icon={warningOutline} />
                  {day.conflicts === 1 ? '1 clash' : `${day.conflicts} clashes`}
                </span>
              ) : null}
            </button>
            {/* The day from 6:00 to 21:00, each visit a bar (the list below says it in words). */}
            <div className="pp-cal__bar" aria-hidden="true">
              {stops.map((s) => {
                const p = placeInDay(s.booking, day.dayMs);
                return (
                  <span
                    key={s.booking.id}
                    className={`pp-cal__bar-visit${s.conflicts.length ? ' pp-cal__bar-visit--conflict' : ''}`}
                    style={{ left: `${p.top * 100}%`, width: `${Math.max(p.height * 100, 1.5)}%` }}
                  />
                );
              })}
            </div>
            {stops.length ? (
              <ul className="pp-cal__week-list">
                {stops.map((s) => (
                  <li key={s.booking.id}>
                    <Link to={`/jobs/${s.booking.id}`}>
                      {time(s.booking.startMs)}–{time(s.booking.endMs)}{' '}
                      {s.booking.summary.customerName}
                    </Link>
                    {s.conflicts.length ? (
                      <span className="pp-cal__day-warn">
                        <Icon icon={warningOutline} />
                        clash
                      </span>
                    ) : null}
                  </li>
                ))}
              </ul>
            ) : null}
          </li>
        );
      })}
    </ol>
  );
}

/**
 * Bookings by day or by week. A day lists each person's stops in order with the drive from
 * the stop before (shared drive time, the business's factors) and flags overlapping windows
 * and gaps too short for the drive; a visit's time can be moved, offline too. A helper sees
 * only their own visits.
 */
export function CalendarScreen() {
  const bookings = useCalendarBookings();
  const units = useUnits();
  const user = useSession()?.user ?? null;
  const names = useTeamNames();
  const now = useServerNow(60_000);
  const todayMs = startOfDay(now);
  const [view, setView] = useState<'day' | 'week'>('day');
  const [dayMs, setDayMs] = useState(todayMs);
  const drive: DriveSettings = units.drive;

  const day = useMemo(() => layoutDay(bookings ?? [], dayMs, drive), [bookings, dayMs, drive]);
  const week = useMemo(() => layoutWeek(bookings ?? [], dayMs, drive), [bookings, dayMs, drive]);

  if (bookings === undefined || !user) return <div className="pp-loading" aria-busy="true" />;
  const isOwner = user.role === 'owner';
  const routeName = (who: string | null) =>
    who === null
      ? isOwner
        ? 'Your visits'
        : 'Visits'
      : who === user.id
        ? 'Your visits'
        : `${names.get(who) ?? 'A helper'}'s visits`;
  const step = view === 'day' ? 1 : 7;
  const monday = startOfWeek(dayMs);
  const title =
    view === 'day'
      ? dayTitle(dayMs)
      : `Week of ${new Date(monday).toLocaleDateString(undefined, { day: 'numeric', month: 'long' })}`;

  return (
    <div className="pp-cal">
      <div className="pp-filter" role="group" aria-label="Show">
        {(['day', 'week'] as const).map((v) => (
          <button
            key={v}
            type="button"
            className="pp-filter__chip"
            aria-pressed={view === v}
            onClick={() => setView(v)}
          >
            {v === 'day' ? 'Day' : 'Week'}
          </button>
        ))}
      </div>
      <div className="pp-cal__nav">
        <button
          type="button"
          className="pp-cal__arrow"
          aria-label={view === 'day' ? 'Day before' : 'Week before'}
          onClick={() => setDayMs(addDays(dayMs, -step))}
        >
          <Icon icon={chevronBack} />
        </button>
        <h2 className="pp-cal__title" aria-live="polite">
          {title}
        </h2>
        <button
          type="button"
          className="pp-cal__arrow"
          aria-label={view === 'day' ? 'Day after' : 'Week after'}
          onClick={() => setDayMs(addDays(dayMs, step))}
        >
          <Icon icon={chevronForward} />
        </button>
      </div>
      {dayMs !== todayMs ? (
        <button type="button" className="pp-link pp-cal__plain" onClick={() => setDayMs(todayMs)}>
          Back to today
        </button>
      ) : null}
      {!isOwner ? <p className="pp-cal__note">Your own visits only.</p> : null}
      {view === 'day' ? (
        <DayView day={day} canMove={isOwner} routeName={routeName} />
      ) : (
        <WeekView
          days={week}
          todayMs={todayMs}
          onOpenDay={(ms) => {
            setDayMs(ms);
            setView('day');
          }}
        />
      )}
      <p className="pp-cal__note">
        Drive times are estimates from the map positions: straight-line distance ×{' '}
        {drive.roadFactor} for the roads, at {drive.averageKmh} km/h (common practice, no published
        source; change them in Settings). A clash is two visits of one person that overlap, or a gap
        shorter than the drive between them.
      </p>
    </div>
  );
}
