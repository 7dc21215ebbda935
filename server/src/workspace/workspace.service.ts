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
import { DataSource, type EntityTarget, type ObjectLiteral } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { ChecklistItem } from '../checklist/checklist-item.entity';
import { ChipLayer } from '../chips/chip-layer.entity';
import { Chip } from '../chips/chip.entity';
import { chipPlan, type ChipPlanAnswer } from '../chips/plan';
import { ClimateReading } from '../climate/climate-reading.entity';
import { describeClimate, type ClimateAnswer } from '../climate/climate.service';
import { notFound } from '../common/app.exception';
import { jobScopeSql } from '../common/scope';
import { jsonRows } from '../database/json-rows';
import { preparedQuery } from '../database/prepared-query';
import { Job } from '../jobs/job.entity';
import { Customer } from '../customers/customer.entity';
import { JobsService, summarySql, type Summarized, type SummaryParts } from '../jobs/jobs.service';
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
  job: Omit<Summarized<Job>, 'notes'> & { notes?: string };
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
    // The job in the actor's scope and everything of it, in one statement (one snapshot).
    const params: unknown[] = [];
    const scope = jobScopeSql(actor, jobId, params);
    const b = `$${params.push(actor.businessId)}`;
    const of = `t.job_id = $1 AND t.business_id = ${b} AND t.deleted_at IS NULL`;
    const own = (table: string) =>
      `SELECT product_id FROM ${table} WHERE job_id = $1 AND business_id = ${b} AND deleted_at IS NULL`;
    const r = <T extends ObjectLiteral>(entity: EntityTarget<T>) => jsonRows(this.db, entity);
    const [row] = await preparedQuery<
      SummaryParts & {
        job: unknown[] | null;
        customer: unknown[] | null;
        vehicle: unknown[] | null;
      } & Record<string, unknown[][] | null>
    >(
      this.db,
      `WITH j AS MATERIALIZED (SELECT t.* FROM jobs t WHERE ${scope})
       SELECT (SELECT ${r(Job).row('j')} FROM j) AS job,
         ${summarySql()},
         ${r(Customer).one('t.id = (SELECT customer_id FROM j)')} AS customer,
         ${r(Vehicle).one('t.id = (SELECT vehicle_id FROM j)')} AS vehicle,
         ${r(JobPanel).list(of, 't.position ASC')} AS panels,
         ${r(FilmReading).list(of, 't.taken_at ASC, t.version ASC')} AS readings,
         ${r(CorrectionPass).list(of)} AS passes,
         ${r(DamagePin).list(of, 't.number ASC')} AS pins,
         ${r(Chip).list(of, 't.number ASC')} AS chips,
         ${r(ChipLayer).list(of, 't.applied_at ASC, t.version ASC')} AS layers,
         ${r(SolventApplication).list(of, 't.applied_at ASC')} AS solvents,
         ${r(MaskingItem).list(of, 't.applied_at ASC')} AS masking,
         ${r(Timer).list(of, 't.ends_at ASC')} AS timers,
         ${r(ChecklistItem).list(of, 't.position ASC')} AS checklist,
         ${r(ClimateReading).list(of, 't.taken_at ASC')} AS climate,
         ${r(Product).list(
           `t.business_id = ${b} AND t.id IN (${[
             'correction_passes',
             'chips',
             'chip_layers',
             'solvent_applications',
             'masking_items',
           ]
             .map(own)
             .join(' UNION ')})`,
           't.id',
         )} AS products`,
      params,
    );
    if (!row?.job) throw notFound('Job');
    const job = r(Job).hydrate(row.job);
    const [summary] = this.jobs.summarizeWith(actor, [job], row);
    const customer = row.customer ? r(Customer).hydrate(row.customer) : undefined;
    const vehicle = row.vehicle ? r(Vehicle).hydrate(row.vehicle) : undefined;
    if (!customer || !vehicle) throw new Error(`Job ${job.id} without its customer or vehicle`);
    const panels = r(JobPanel).hydrateAll(row.panels);
    const readings = r(FilmReading).hydrateAll(row.readings);
    const passes = r(CorrectionPass).hydrateAll(row.passes);
    const pins = r(DamagePin).hydrateAll(row.pins);
    const chips = r(Chip).hydrateAll(row.chips);
    const layers = r(ChipLayer).hydrateAll(row.layers);
    const solvents = r(SolventApplication).hydrateAll(row.solvents);
    const masking = r(MaskingItem).hydrateAll(row.masking);
    const timers = r(Timer).hydrateAll(row.timers);
    const checklist = r(ChecklistItem).hydrateAll(row.checklist);
    const climate = r(ClimateReading).hydrateAll(row.climate);
    const products = r(Product).hydrateAll(row.products);
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
