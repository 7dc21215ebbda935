import { NestFactory } from '@nestjs/core';
import { bodyStyleTemplate, childId, JOB_STAGES } from '@panelpass/shared';
import * as argon2 from 'argon2';
import { randomUUID } from 'node:crypto';
import { DataSource } from 'typeorm';
import type { Actor } from '../../auth/current-user.decorator';
import { Business } from '../../businesses/business.entity';
import { CommandBus } from '../../commands/command-bus.service';
import { User } from '../../users/user.entity';
import {
  DEMO_PASSWORD,
  demoBusiness,
  demoPeople,
  demoProducts,
  demoReadings,
  demoVisits,
  panelsOf,
  type ProductKey,
} from './demo';

const MIN = 60_000;
const HOUR = 60 * MIN;

/** Local midnight `days` from today, plus `hours`. */
function at(days: number, hours: number): Date {
  const d = new Date();
  d.setHours(0, 0, 0, 0);
  d.setDate(d.getDate() + days);
  return new Date(d.getTime() + hours * HOUR);
}

/**
 * Loads the demo business into an empty database; leaves a database with data alone. The
 * records go through the same commands the app uses, so everything computed (flush-by times,
 * budgets, stock) is what the app would compute.
 */
export async function seedDemo(ds: DataSource, bus: CommandBus): Promise<boolean> {
  if ((await ds.getRepository(Business).count()) > 0) return false;
  const passwordHash = await argon2.hash(DEMO_PASSWORD, {
    type: argon2.argon2id,
    memoryCost: 19456,
    timeCost: 2,
    parallelism: 1,
  });
  const { business, people } = await ds.transaction(async (m) => {
    const business = await m.save(m.create(Business, { name: demoBusiness.name }));
    const people: Record<string, User> = {};
    for (const p of demoPeople) {
      people[p.key] = await m.save(
        m.create(User, {
          businessId: business.id,
          email: p.email,
          name: p.name,
          role: p.role,
          passwordHash,
        }),
      );
    }
    return { business, people };
  });
  const owner: Actor = { userId: people.owner!.id, businessId: business.id, role: 'owner' };
  const helper: Actor = { userId: people.helper!.id, businessId: business.id, role: 'tech' };
  const run = (actor: Actor, name: string, args: Record<string, unknown>) =>
    bus.execute(actor, name, args, 'seed');
  /** The demo's money came in on the visit's day, not when the seed runs (demo data only). */
  const paidDuringVisit = (paymentId: string, when: Date) =>
    ds.query('UPDATE payments SET paid_at = $2 WHERE id = $1', [paymentId, when]);

  const product = {} as Record<ProductKey, string>;
  for (const [key, fields] of Object.entries(demoProducts) as [
    ProductKey,
    Record<string, unknown>,
  ][]) {
    product[key] = randomUUID();
    await run(owner, 'product.create', { id: product[key], ...fields });
  }

  for (const visit of demoVisits) {
    const customerId = randomUUID();
    const vehicleId = randomUUID();
    const jobId = randomUUID();
    const start = at(visit.day, visit.from);
    const worker = visit.helper ? helper : owner;
    await run(owner, 'customer.create', { id: customerId, ...visit.customer });
    await run(owner, 'vehicle.create', { id: vehicleId, customerId, ...visit.vehicle });
    await run(owner, 'job.create', {
      id: jobId,
      customerId,
      vehicleId,
      windowStart: start,
      windowEnd: at(visit.day, visit.to),
      priceMinor: visit.priceMinor,
      services: visit.services,
      notes: visit.notes,
      ...(visit.helper ? { assignedTechId: helper.userId } : {}),
    });
    const target = JOB_STAGES.indexOf(visit.stage);
    const panels = panelsOf(visit.vehicle.bodyStyle);
    const panel = (key: string) => childId(jobId, `panel:${key}`);
    const setStage = async (stage: string) => run(worker, 'job.setStage', { id: jobId, stage });
    /** A moment of the visit, never in the future (the seed may run before the visit starts). */
    const during = (minutes: number) =>
      new Date(Math.min(start.getTime() + minutes * MIN, Date.now() - (90 - minutes / 4) * MIN));

    if (target >= JOB_STAGES.indexOf('walkaround')) {
      await setStage('walkaround');
      if (visit.conditionNotes)
        await run(worker, 'job.update', { id: jobId, conditionNotes: visit.conditionNotes });
      const repainted = visit.key === 'suv' ? 'left-front-door' : undefined;
      for (const { id: key, substrate } of bodyStyleTemplate(visit.vehicle.bodyStyle)) {
        const substrateIsPlastic = substrate === 'plastic' || substrate === 'composite';
        await run(worker, 'reading.add', {
          id: randomUUID(),
          jobId,
          panelId: panel(key),
          phase: 'before',
          readings: demoReadings(key, { repainted, thinBy: visit.key === 'suv' ? 14 : 0 }),
          unit: 'um',
          gaugeType: substrateIsPlastic ? 'ultrasonic' : 'magnetic-eddy',
          takenAt: during(20),
        });
      }
      await run(worker, 'pin.add', {
        id: randomUUID(),
        jobId,
        x: 0.32,
        y: 0.18,
        panelKey: panels[1] ?? null,
        kind: visit.key === 'wagon' ? 'etching' : 'scratch',
        severity: 2,
        note:
          visit.key === 'wagon'
            ? 'Sap etching, several spots'
            : 'Deep scratch, will not fully correct',
      });
      await run(worker, 'climate.record', {
        id: randomUUID(),
        jobId,
        airC: 17,
        rhPct: 64,
        surfaceC: 19,
        takenAt: during(10),
      });
    }
    if (visit.key === 'wagon') {
      for (let n = 1; n <= 8; n++) {
        const chipId = randomUUID();
        await run(worker, 'chip.add', {
          id: chipId,
          jobId,
          panelId: panel(n <= 5 ? 'hood' : 'front-bumper'),
          sizeMm: 1 + (n % 3) * 0.5,
          productId: product.touchUpGreen,
          layersPlanned: 3,
        });
        if (n <= 3) {
          await run(worker, 'chip.addLayer', {
            id: randomUUID(),
            chipId,
            productId: product.touchUpGreen,
            appliedAt: during(40),
          });
        }
      }
    }
    if (target >= JOB_STAGES.indexOf('prep')) {
      await setStage('prep');
      const checks = ['prep.rinse-wash', 'prep.iron', 'prep.dry'];
      for (const key of checks)
        await run(worker, 'check.toggle', { id: childId(jobId, `check:${key}`), done: true });
      const solventId = randomUUID();
      await run(worker, 'solvent.apply', {
        id: solventId,
        jobId,
        panelId: panel(panels[0]!),
        productId: visit.key === 'wagon' ? product.sap : product.tar,
        surfaceTempC: 21,
        inSun: visit.key !== 'wagon',
        appliedAt: new Date(Date.now() - 2 * MIN),
      });
      if (visit.key !== 'wagon') await run(worker, 'solvent.flush', { id: solventId });
      await run(worker, 'mask.add', {
        id: randomUUID(),
        jobId,
        what: 'Textured plastic on the mirror caps',
        productId: product.tape,
        appliedAt: during(50),
      });
    }
    if (target >= JOB_STAGES.indexOf('correction')) {
      await setStage('correction');
      for (const key of panels.slice(0, 2)) {
        await run(worker, 'pass.log', {
          id: randomUUID(),
          jobId,
          panelId: panel(key),
          step: 'heavy-compound',
          machine: 'rotary',
          pad: 'Foam cutting pad',
          productId: product.heavyCompound,
          speedSetting: '1200 rpm',
          passes: 2,
          result: 'change-combination',
        });
        await run(worker, 'pass.log', {
          id: randomUUID(),
          jobId,
          panelId: panel(key),
          step: 'polish',
          machine: 'dual-action',
          pad: 'Foam polishing pad',
          productId: product.finishing,
          speedSetting: '5',
          passes: 2,
          result: 'done',
        });
      }
      const depositId = randomUUID();
      await run(owner, 'payment.recordCash', {
        id: depositId,
        opId: randomUUID(),
        jobId,
        kind: 'deposit',
        method: 'cash',
        amountMinor: depositOf(visit.priceMinor),
      });
      await paidDuringVisit(depositId, during(120));
    }
    if (visit.stage === 'closed' || visit.stage === 'handover') {
      for (const stage of ['correction', 'finish']) await setStage(stage);
      const keepDry = randomUUID();
      await run(worker, 'timer.start', {
        id: keepDry,
        jobId,
        kind: 'keep-dry',
        label: 'Keep dry: glass coat',
        startedAt: during(300),
        durationMs: 12 * HOUR,
      });
      await run(worker, 'timer.ack', { id: keepDry });
      await setStage('handover');
    }
    if (visit.stage === 'closed') {
      const balanceId = randomUUID();
      await run(owner, 'payment.recordCash', {
        id: balanceId,
        opId: randomUUID(),
        jobId,
        kind: 'balance',
        method: 'cheque',
        // What is left after the deposit: the visit is paid in full, never over.
        amountMinor: visit.priceMinor - depositOf(visit.priceMinor),
      });
      await paidDuringVisit(balanceId, during(330));
      await setStage('closed');
    }
  }
  return true;
}

/** The demo's cash deposit: a fifth of the price, taken once correction starts. */
function depositOf(priceMinor: number): number {
  return Math.round(priceMinor * 0.2);
}

async function main(): Promise<void> {
  // Loaded here: the app module checks the settings when it is first imported.
  const { AppModule } = await import('../../app.module');
  const app = await NestFactory.createApplicationContext(AppModule, { logger: ['error'] });
  try {
    const loaded = await seedDemo(app.get(DataSource), app.get(CommandBus));
    console.log(
      loaded
        ? `Loaded the demo business "${demoBusiness.name}"`
        : 'Database already has data; demo not loaded (scripts/db reset empties it)',
    );
  } finally {
    await app.close();
  }
}

if (require.main === module) {
  main().catch((e: unknown) => {
    console.error(e instanceof Error ? e.message : e);
    process.exit(1);
  });
}
