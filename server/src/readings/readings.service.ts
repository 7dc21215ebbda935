import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import {
  checkGaugeOnSubstrate,
  spotMean,
  toMicrometres,
  type Reason,
  type Substrate,
} from '@panelpass/shared';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException } from '../common/app.exception';
import type { JobPanel } from '../panels/job-panel.entity';
import { fromShared, panelOfJob, startCreate, whenOrNow } from '../workspace/field';
import { AddReadingDto } from './dto/reading.dto';
import { FilmReading } from './film-reading.entity';

export interface ReadingAnswer extends FilmReading {
  /** The spot: the mean of its readings (µm), shared `spotMean`. */
  spotMeanUm: number;
  /** Why the reading may need a second look (substrate unknown, fewer than 3 readings…). */
  reasons: Reason[];
}

@Injectable()
export class ReadingsService implements OnModuleInit {
  constructor(private readonly bus: CommandBus) {}

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'reading.add',
        args: AddReadingDto,
        roles: ['owner', 'tech'],
        run: (c, a) => this.add(c, a),
      }),
    );
  }

  /**
   * A spot of gauge readings, stored in µm. A gauge that cannot measure on the panel's
   * substrate (a magnetic gauge on a plastic bumper) is refused: its number is not a film
   * thickness.
   */
  async add({ actor, m }: CommandContext, a: AddReadingDto): Promise<ReadingAnswer> {
    const { existing } = await startCreate(m, actor, FilmReading, a.id, a.jobId);
    const panel = await panelOfJob(m, actor, existing?.panelId ?? a.panelId, a.jobId);
    if (existing) return describe(existing, panel);
    const check = fromShared(() =>
      checkGaugeOnSubstrate(a.gaugeType, panel.substrate as Substrate),
    );
    if (check.validity === 'not-valid') {
      const why = check.reasons[0];
      throw new AppException(
        HttpStatus.BAD_REQUEST,
        'gauge-not-valid-on-substrate',
        why?.message ?? `A ${a.gaugeType} gauge cannot measure on ${panel.substrate}`,
        { field: 'gaugeType', substrate: panel.substrate, reasons: check.reasons },
      );
    }
    const readingsUm = a.readings.map((v, i) =>
      fromShared(() => toMicrometres(v, a.unit, `readings[${i}]`)),
    );
    await m.insert(FilmReading, {
      id: a.id,
      businessId: actor.businessId,
      jobId: a.jobId,
      panelId: panel.id,
      phase: a.phase,
      readingsUm,
      unit: a.unit,
      gaugeType: a.gaugeType,
      takenAt: whenOrNow(a.takenAt, 'takenAt'),
      takenBy: actor.userId,
    });
    return describe(await m.findOneByOrFail(FilmReading, { id: a.id }), panel);
  }
}

function describe(reading: FilmReading, panel: JobPanel): ReadingAnswer {
  const spot = spotMean(reading.readingsUm);
  const check = checkGaugeOnSubstrate(
    reading.gaugeType as Parameters<typeof checkGaugeOnSubstrate>[0],
    panel.substrate as Substrate,
  );
  return {
    ...reading,
    spotMeanUm: spot.meanUm,
    reasons: [...check.reasons, ...spot.reasons],
  };
}
