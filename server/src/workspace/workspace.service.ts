import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import {
  boardProgress,
  checkGaugeOnSubstrate,
  filmStats,
  flagPanels,
  spotMean,
  type BoardProgress,
  type ClearCoatBudgetResult,
  type FilmStats,
  type FlagPanelsResult,
  type GaugeKind,
  type PanelFlags,
  type PanelState,
  type Substrate,
} from '@panelpass/shared';
import { DataSource, In } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { ChecklistItem } from '../checklist/checklist-item.entity';
import { ChipLayer } from '../chips/chip-layer.entity';
import { Chip } from '../chips/chip.entity';
import { chipPlan, type ChipPlanAnswer } from '../chips/plan';
import { ClimateReading } from '../climate/climate-reading.entity';
import { describeClimate, type ClimateAnswer } from '../climate/climate.service';
import { jobInScope } from '../common/scope';
import { Customer } from '../customers/customer.entity';
import { JobsService, type JobSummary } from '../jobs/jobs.service';
import { MaskingItem } from '../masking/masking-item.entity';
import { describeMask, type MaskAnswer } from '../masking/masking.service';
import { JobPanel } from '../panels/job-panel.entity';
import { byTime, panelBudget } from '../passes/budget';
import { CorrectionPass } from '../passes/correction-pass.entity';
import { DamagePin } from '../pins/damage-pin.entity';
import { Product } from '../products/product.entity';
import { FilmReading } from '../readings/film-reading.entity';
import { SolventApplication } from '../solvents/solvent-application.entity';
import { describeSolvent, type SolventAnswer } from '../solvents/solvents.service';
import { Timer } from '../timers/timer.entity';
import { timerView, type TimerView } from '../timers/timers.service';
import { Vehicle } from '../vehicles/vehicle.entity';
import { type Caution, cautionsFor, fromShared } from './field';

export interface WorkspaceReading extends FilmReading {
  spotMeanUm: number;
}

export interface WorkspacePanel extends Omit<JobPanel, 'testSpotNote'> {
  testSpotNote?: string;
  readings: WorkspaceReading[];
  /** Shared `filmStats` of the valid gauge readings of each phase; null without readings. */
  stats: { before: FilmStats | null; after: FilmStats | null };
  /** Shared `flagPanels` against the vehicle's own baseline; null without "before" readings. */
  flags: PanelFlags | null;
  /** Shared `clearCoatBudget` from the "before" readings and the logged passes. */
  budget: ClearCoatBudgetResult;
  passes: Omit<CorrectionPass, 'note'>[];
}

export interface ProductRef {
  id: string;
  name: string;
  kind: string;
  sdsUrl: string | null;
}

export interface Workspace {
  /** The server's clock, so a device can correct its own for timers. */
  serverNow: string;
  job: Omit<JobSummary, 'notes'> & { notes?: string };
  customer: Omit<Customer, 'notes'> & { notes?: string };
  vehicle: Vehicle;
  /** Top-down, in the body-style template's order. */
  panels: WorkspacePanel[];
  /** Baseline of the vehicle's metal panels and the reasons of the comparison. */
  film: Pick<FlagPanelsResult, 'baselineUm' | 'reasons'> | null;
  progress: BoardProgress | null;
  pins: DamagePin[];
  chips: (Chip & { layers: ChipLayer[]; schedule: ChipPlanAnswer })[];
  solvents: Omit<SolventAnswer, 'timer' | 'cautions'>[];
  masking: MaskAnswer[];
  timers: TimerView[];
  checklist: ChecklistItem[];
  climate: ClimateAnswer[];
  /** The Shelf products the records name (never their cost). */
  products: ProductRef[];
  /** Solvent and touch-up work: protection, ventilation, and the product's safety data sheet. */
  cautions: Caution[];
}

const validOn = (r: FilmReading, panel: JobPanel) =>
  checkGaugeOnSubstrate(r.gaugeType as GaugeKind, panel.substrate as Substrate).validity !==
  'not-valid';

@Injectable()
export class WorkspaceService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly jobs: JobsService,
  ) {}

  /** Everything the job's screens show, with every computed value from @panelpass/shared. */
  async get(actor: Actor, jobId: string): Promise<Workspace> {
    const m = this.db.manager;
    const job = await jobInScope(m, actor, jobId);
    const where = { jobId: job.id, businessId: actor.businessId };
    const [
      [summary],
      customer,
      vehicle,
      panels,
      readings,
      passes,
      pins,
      chips,
      layers,
      solvents,
      masking,
      timers,
      checklist,
      climate,
    ] = await Promise.all([
      this.jobs.summarize(m, actor, [job]),
      m.findOneOrFail(Customer, { where: { id: job.customerId }, withDeleted: true }),
      m.findOneOrFail(Vehicle, { where: { id: job.vehicleId }, withDeleted: true }),
      m.find(JobPanel, { where, order: { position: 'ASC' } }),
      m.find(FilmReading, { where, order: { takenAt: 'ASC', version: 'ASC' } }),
      m.find(CorrectionPass, { where }),
      m.find(DamagePin, { where, order: { number: 'ASC' } }),
      m.find(Chip, { where, order: { number: 'ASC' } }),
      m.find(ChipLayer, { where, order: { appliedAt: 'ASC', version: 'ASC' } }),
      m.find(SolventApplication, { where, order: { appliedAt: 'ASC' } }),
      m.find(MaskingItem, { where, order: { appliedAt: 'ASC' } }),
      m.find(Timer, { where, order: { endsAt: 'ASC' } }),
      m.find(ChecklistItem, { where, order: { position: 'ASC' } }),
      m.find(ClimateReading, { where, order: { takenAt: 'ASC' } }),
    ]);
    const productIds = [
      ...passes.map((p) => p.productId),
      ...chips.map((c) => c.productId),
      ...layers.map((l) => l.productId),
      ...solvents.map((s) => s.productId),
      ...masking.map((k) => k.productId),
    ].filter((id): id is string => !!id);
    const products = productIds.length
      ? await m.find(Product, {
          where: { id: In([...new Set(productIds)]), businessId: actor.businessId },
          withDeleted: true,
        })
      : [];
    const productById = new Map(products.map((p) => [p.id, p]));
    const product = (id: string | null | undefined) => (id ? (productById.get(id) ?? null) : null);
    const now = Date.now();
    const forCustomer = actor.role === 'customer';

    // Film: each panel's "before" spots against the vehicle's own baseline.
    const filmInputs = panels.flatMap((panel) => {
      const before = readings.filter((r) => r.panelId === panel.id && r.phase === 'before');
      const last = before.at(-1);
      return last
        ? [
            {
              panelId: panel.id,
              substrate: panel.substrate as Substrate,
              gauge: last.gaugeType as GaugeKind,
              spotMeansUm: before.map((r) => spotMean(r.readingsUm).meanUm),
            },
          ]
        : [];
    });
    const film = filmInputs.length ? fromShared(() => flagPanels({ panels: filmInputs })) : null;

    const workspacePanels = panels.map((panel): WorkspacePanel => {
      const own = readings.filter((r) => r.panelId === panel.id);
      const stats = (phase: string) => {
        const values = own
          .filter((r) => r.phase === phase && validOn(r, panel))
          .flatMap((r) => r.readingsUm);
        return values.length ? filmStats(values) : null;
      };
      const { testSpotNote, ...rest } = panel;
      return {
        ...rest,
        ...(forCustomer ? {} : { testSpotNote }),
        readings: own.map((r) => ({ ...r, spotMeanUm: spotMean(r.readingsUm).meanUm })),
        stats: { before: stats('before'), after: stats('after') },
        flags: film?.panels.find((f) => f.panelId === panel.id) ?? null,
        budget: panelBudget(panel, readings, passes),
        passes: passes
          .filter((p) => p.panelId === panel.id)
          .sort(byTime)
          .map((p) => {
            if (!forCustomer) return p;
            const { note: _note, ...shown } = p;
            return shown;
          }),
      };
    });

    const solventProducts = new Map<string, Product>();
    for (const s of solvents) {
      const p = product(s.productId);
      if (p) solventProducts.set(p.id, p);
    }
    const touchUpProducts = new Map<string, Product>();
    for (const c of [...chips, ...layers]) {
      const p = product(c.productId);
      if (p) touchUpProducts.set(p.id, p);
    }
    const sdsLines = (applies: 'solvent' | 'touch-up', list: Product[]) =>
      list.flatMap((p) => cautionsFor(applies, p).filter((c) => c.code.endsWith('-sds')));
    const cautions = [
      ...cautionsFor('solvent'),
      ...sdsLines('solvent', [...solventProducts.values()]),
      ...cautionsFor('touch-up'),
      ...sdsLines('touch-up', [...touchUpProducts.values()]),
    ];

    const { notes: jobNotes, ...jobRest } = summary!;
    const { notes: customerNotes, ...customerRest } = customer;
    return {
      serverNow: new Date(now).toISOString(),
      job: forCustomer ? jobRest : { ...jobRest, notes: jobNotes },
      customer: forCustomer ? customerRest : { ...customerRest, notes: customerNotes },
      vehicle,
      panels: workspacePanels,
      film: film ? { baselineUm: film.baselineUm, reasons: film.reasons } : null,
      progress: panels.length
        ? fromShared(() =>
            boardProgress(
              panels.map((p) => ({ id: p.id, state: p.state as PanelState, areaM2: p.areaM2 })),
            ),
          )
        : null,
      pins,
      chips: chips.map((chip) => {
        const own = layers.filter((l) => l.chipId === chip.id);
        return {
          ...chip,
          layers: own,
          schedule: chipPlan(
            chip,
            own,
            product(chip.productId ?? own.at(-1)?.productId),
            climate,
            now,
          ),
        };
      }),
      solvents: solvents.map((s) => {
        const { cautions: _c, ...shown } = describeSolvent(s, product(s.productId), now);
        return shown;
      }),
      masking: masking.map((k) => describeMask(k, product(k.productId), now)),
      timers: timers.map((t) => timerView(t, now)),
      checklist,
      climate: climate.map(describeClimate),
      products: products.map((p) => ({ id: p.id, name: p.name, kind: p.kind, sdsUrl: p.sdsUrl })),
      cautions,
    };
  }
}
