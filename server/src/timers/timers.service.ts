import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, type EntityManager } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException, notFound } from '../common/app.exception';
import { alreadyCreated, findInBusiness, jobInScope } from '../common/scope';
import { startCreate, whenOrNow } from '../workspace/field';
import { MAX_TIMER_MS, StartTimerDto, TimerAtDto, TimerIdDto } from './dto/timer.dto';
import { Timer } from './timer.entity';

export type TimerState = 'running' | 'paused' | 'ended' | 'acknowledged' | 'cancelled';

export interface TimerView extends Timer {
  /** At the server's clock when answered; the device counts from endsAt itself. */
  state: TimerState;
  /** Left to run (ms) at the server's clock; frozen while paused; 0 once ended. */
  remainingMs: number;
}

/** What a timer is doing at `now` (from its stored absolute times, never from ticks). */
export function timerView(t: Timer, now = Date.now()): TimerView {
  const paused = t.pausedAt !== null;
  const at = paused ? t.pausedAt!.getTime() : now;
  const remainingMs = Math.max(0, t.endsAt.getTime() - at);
  const state: TimerState = t.cancelledAt
    ? 'cancelled'
    : t.acknowledgedAt
      ? 'acknowledged'
      : paused
        ? 'paused'
        : remainingMs === 0
          ? 'ended'
          : 'running';
  return { ...t, state, remainingMs };
}

const ALLOWED: Record<TimerState, string[]> = {
  running: ['pause', 'ack', 'cancel'],
  paused: ['resume', 'ack', 'cancel'],
  ended: ['ack', 'cancel'],
  acknowledged: [],
  cancelled: [],
};

function notAllowed(action: string, state: TimerState): AppException {
  const allowed = ALLOWED[state];
  return new AppException(
    HttpStatus.CONFLICT,
    'timer-action-not-allowed',
    allowed.length
      ? `A ${state} timer can ${allowed.join(', ')}; not ${action}`
      : `A timer ${state} takes no more changes`,
    { state, action, allowed },
  );
}

function badTime(field: string, message: string): AppException {
  return new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', message, [
    { field, rules: { order: message } },
  ]);
}

@Injectable()
export class TimersService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
  ) {}

  onModuleInit(): void {
    const roles = ['owner', 'tech'] as const;
    this.bus.register(
      command({ name: 'timer.start', args: StartTimerDto, roles, run: (c, a) => this.start(c, a) }),
      command({ name: 'timer.pause', args: TimerAtDto, roles, run: (c, a) => this.pause(c, a) }),
      command({ name: 'timer.resume', args: TimerAtDto, roles, run: (c, a) => this.resume(c, a) }),
      command({ name: 'timer.ack', args: TimerIdDto, roles, run: (c, a) => this.ack(c, a) }),
      command({ name: 'timer.cancel', args: TimerIdDto, roles, run: (c, a) => this.cancel(c, a) }),
    );
  }

  /** An absolute end time: startedAt + durationMs, or endsAt. A timer without a job is the owner's. */
  async start({ actor, m }: CommandContext, a: StartTimerDto): Promise<TimerView> {
    if (a.jobId) {
      const { existing } = await startCreate(m, actor, Timer, a.id, a.jobId);
      if (existing) return timerView(existing);
    } else {
      if (actor.role !== 'owner') {
        throw new AppException(
          HttpStatus.FORBIDDEN,
          'forbidden',
          'A timer without a job is the owner’s own; a helper starts timers on a job',
        );
      }
      const existing = await alreadyCreated(m, Timer, actor, a.id);
      if (existing) {
        if (existing.jobId !== null) {
          throw new AppException(HttpStatus.CONFLICT, 'id-taken', 'That id is already in use');
        }
        return timerView(existing);
      }
    }
    if (a.durationMs !== undefined && a.endsAt !== undefined) {
      throw badTime('endsAt', 'Give durationMs or endsAt, not both');
    }
    const startedAt = whenOrNow(a.startedAt, 'startedAt');
    const endsAt = a.endsAt ?? new Date(startedAt.getTime() + (a.durationMs ?? 0));
    if (endsAt.getTime() <= startedAt.getTime()) {
      throw badTime('endsAt', 'endsAt must be after startedAt');
    }
    if (endsAt.getTime() - startedAt.getTime() > MAX_TIMER_MS) {
      throw badTime('endsAt', 'A timer may run at most 30 days');
    }
    await m.insert(Timer, {
      id: a.id,
      businessId: actor.businessId,
      jobId: a.jobId ?? null,
      kind: a.kind,
      subjectType: a.subjectType ?? null,
      subjectId: a.subjectId ?? null,
      label: a.label,
      startedAt,
      endsAt,
      startedBy: actor.userId,
    });
    return timerView(await m.findOneByOrFail(Timer, { id: a.id }));
  }

  /** Stops the clock; pausing a paused timer changes nothing. */
  async pause({ actor, m }: CommandContext, a: TimerAtDto): Promise<TimerView> {
    const timer = await this.timerInScope(m, actor, a.id);
    const view = timerView(timer);
    if (view.state === 'paused') return view;
    if (view.state !== 'running') throw notAllowed('pause', view.state);
    const at = whenOrNow(a.at, 'at');
    if (at.getTime() < timer.startedAt.getTime()) {
      throw badTime('at', 'at must not be before the timer started');
    }
    if (at.getTime() >= timer.endsAt.getTime()) throw notAllowed('pause', 'ended');
    await m.update(Timer, { id: timer.id }, { pausedAt: at });
    return timerView(await m.findOneByOrFail(Timer, { id: timer.id }));
  }

  /** Starts the clock again: the paused span is added to pausedMs and pushes endsAt later by it. */
  async resume({ actor, m }: CommandContext, a: TimerAtDto): Promise<TimerView> {
    const timer = await this.timerInScope(m, actor, a.id);
    const view = timerView(timer);
    if (view.state === 'running') return view;
    if (view.state !== 'paused' || !timer.pausedAt) throw notAllowed('resume', view.state);
    const at = whenOrNow(a.at, 'at');
    const spanMs = at.getTime() - timer.pausedAt.getTime();
    if (spanMs < 0) throw badTime('at', 'at must not be before the pause');
    await m.update(
      Timer,
      { id: timer.id },
      {
        pausedAt: null,
        pausedMs: timer.pausedMs + spanMs,
        endsAt: new Date(timer.endsAt.getTime() + spanMs),
      },
    );
    return timerView(await m.findOneByOrFail(Timer, { id: timer.id }));
  }

  /** The alarm was seen; once (a second ack changes nothing). */
  async ack({ actor, m }: CommandContext, a: TimerIdDto): Promise<TimerView> {
    const timer = await this.timerInScope(m, actor, a.id);
    if (timer.acknowledgedAt || timer.cancelledAt) return timerView(timer);
    await m.update(Timer, { id: timer.id }, { acknowledgedAt: new Date() });
    return timerView(await m.findOneByOrFail(Timer, { id: timer.id }));
  }

  /** Called off; once. */
  async cancel({ actor, m }: CommandContext, a: TimerIdDto): Promise<TimerView> {
    const timer = await this.timerInScope(m, actor, a.id);
    if (timer.cancelledAt) return timerView(timer);
    if (timer.acknowledgedAt) throw notAllowed('cancel', 'acknowledged');
    await m.update(Timer, { id: timer.id }, { cancelledAt: new Date() });
    return timerView(await m.findOneByOrFail(Timer, { id: timer.id }));
  }

  /** Timers still to be seen to (not acknowledged, not cancelled) on the jobs in scope. */
  async open(actor: Actor): Promise<{ serverNow: string; items: TimerView[] }> {
    const qb = this.db
      .getRepository(Timer)
      .createQueryBuilder('t')
      .where('t.business_id = :b', { b: actor.businessId })
      .andWhere('t.acknowledged_at IS NULL')
      .andWhere('t.cancelled_at IS NULL')
      .orderBy('t.endsAt', 'ASC')
      .addOrderBy('t.id', 'ASC')
      .take(500);
    if (actor.role === 'tech') {
      qb.innerJoin('jobs', 'j', 'j.id = t.job_id AND j.deleted_at IS NULL').andWhere(
        'j.assigned_tech_id = :u',
        { u: actor.userId },
      );
    }
    const now = Date.now();
    const items = (await qb.getMany()).map((t) => timerView(t, now));
    return { serverNow: new Date(now).toISOString(), items };
  }

  /**
   * A timer the actor may act on: of a job in scope (a closed job's timers may still be
   * paused, acknowledged or cancelled), or, without a job, the owner's own.
   */
  private async timerInScope(m: EntityManager, actor: Actor, id: string): Promise<Timer> {
    const timer = await findInBusiness(m, Timer, actor, id, 'Timer');
    if (timer.jobId) {
      await jobInScope(m, actor, timer.jobId).catch((e: unknown) => {
        throw e instanceof AppException && e.getStatus() === 404 ? notFound('Timer') : e;
      });
    } else if (actor.role !== 'owner') {
      throw notFound('Timer');
    }
    return timer;
  }
}
