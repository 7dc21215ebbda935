import { useQuery } from '@tanstack/react-query';
import { useMemo } from 'react';
import { apiClient } from '../../../app/services';
import { useSession } from '../../auth/hooks/useSession';
import { useJobSummaries } from '../../jobs/hooks/useJobSummaries';
import type { JobSummary } from '../../jobs/model/jobSummary';
import type { Booking } from '../model/calendarLayout';

export interface CalendarBooking extends Booking {
  summary: JobSummary;
}

/**
 * The bookings the calendar shows, from the phone's jobs (live, offline): every visit for the
 * owner; for a helper, only the visits given to them (their phone holds no others anyway).
 */
export function useCalendarBookings(): CalendarBooking[] | undefined {
  const jobs = useJobSummaries();
  const user = useSession()?.user ?? null;
  return useMemo(() => {
    if (!jobs || !user) return undefined;
    const mine =
      user.role === 'owner' ? jobs : jobs.filter((j) => j.job.assignedTechId === user.id);
    return mine
      .filter((j) => Number.isFinite(j.startMs) && Number.isFinite(j.endMs))
      .map((summary) => ({
        id: summary.job.id,
        startMs: summary.startMs,
        endMs: summary.endMs,
        lat: summary.job.lat,
        lng: summary.job.lng,
        assignedTechId: summary.job.assignedTechId,
        summary,
      }));
  }, [jobs, user]);
}

interface TeamMember {
  id: string;
  name: string;
  role: string;
}

/**
 * The names of the owner's team (`GET /api/users`), for naming each person's route; with no
 * signal the routes are named in general words.
 */
export function useTeamNames(): ReadonlyMap<string, string> {
  const user = useSession()?.user ?? null;
  const businessId = user?.businessId ?? '';
  const { data } = useQuery({
    queryKey: ['calendar-team', businessId],
    queryFn: ({ signal }) => apiClient.request<TeamMember[]>('/api/users', { signal }),
    enabled: businessId !== '' && user?.role === 'owner',
    staleTime: 10 * 60_000,
  });
  return useMemo(() => new Map((data ?? []).map((m) => [m.id, m.name])), [data]);
}
