import { HttpStatus, Injectable, OnModuleInit } from '@nestjs/common';
import { climateGate, dewPointC, type ClimateGateResult } from '@panelpass/shared';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { AppException } from '../common/app.exception';
import { alreadyCreated } from '../common/scope';
import { fromShared, oneDecimal, startCreate, whenOrNow } from '../workspace/field';
import { ClimateReading } from './climate-reading.entity';
import { RecordClimateDto } from './dto/climate.dto';

export interface ClimateAnswer extends ClimateReading {
  /** Dew point of the air (°C, shared `dewPointC`); null at 0 % humidity. */
  dewPointC: number | null;
  /** Shared `climateGate` without a product (dew-point margin only); null without a panel temperature. */
  gate: ClimateGateResult | null;
}

/** A reading with its dew point and dew-point gate (also used by the workspace). */
export function describeClimate(r: ClimateReading): ClimateAnswer {
  const humid = r.rhPct > 0;
  return {
    ...r,
    dewPointC: humid ? fromShared(() => dewPointC(r.airC, r.rhPct), { rhPercent: 'rhPct' }) : null,
    gate:
      humid && r.surfaceC !== null
        ? fromShared(
            () => climateGate({ airC: r.airC, rhPercent: r.rhPct, surfaceC: r.surfaceC! }),
            {
              rhPercent: 'rhPct',
            },
          )
        : null,
  };
}

@Injectable()
export class ClimateService implements OnModuleInit {
  constructor(private readonly bus: CommandBus) {}

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'climate.record',
        args: RecordClimateDto,
        roles: ['owner', 'tech'],
        run: (c, a) => this.record(c, a),
      }),
    );
  }

  async record({ actor, m }: CommandContext, a: RecordClimateDto): Promise<ClimateAnswer> {
    if (a.jobId) {
      const { existing } = await startCreate(m, actor, ClimateReading, a.id, a.jobId);
      if (existing) return describeClimate(existing);
    } else {
      if (actor.role !== 'owner') {
        throw new AppException(
          HttpStatus.FORBIDDEN,
          'forbidden',
          'A helper records climate readings on a job',
        );
      }
      const existing = await alreadyCreated(m, ClimateReading, actor, a.id);
      if (existing) {
        if (existing.jobId !== null) {
          throw new AppException(HttpStatus.CONFLICT, 'id-taken', 'That id is already in use');
        }
        return describeClimate(existing);
      }
    }
    await m.insert(ClimateReading, {
      id: a.id,
      businessId: actor.businessId,
      jobId: a.jobId ?? null,
      airC: oneDecimal(a.airC),
      rhPct: oneDecimal(a.rhPct),
      surfaceC: a.surfaceC === undefined || a.surfaceC === null ? null : oneDecimal(a.surfaceC),
      takenAt: whenOrNow(a.takenAt, 'takenAt'),
      takenBy: actor.userId,
    });
    return describeClimate(await m.findOneByOrFail(ClimateReading, { id: a.id }));
  }
}
