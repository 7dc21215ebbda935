import type { ChipRow, ProductRow } from '@panelpass/shared';
import { useEffect, useState } from 'react';
import { TextField } from '../../components/TextField';
import { useJobRows } from '../../db/hooks';
import { useChanges } from '../../sync/useChanges';
import { ClimateCard } from '../climate/components/ClimateCard';
import { useJobClimate } from '../climate/hooks/useLatestClimate';
import { decimalText, parseDecimal } from '../prep/kit/numbers';
import { ProductCautions } from '../prep/kit/ProductCautions';
import { clockTime } from '../prep/kit/time';
import { useServerNow } from '../prep/kit/useServerNow';
import { useProductsOfKinds } from '../prep/kit/useStageData';
import { useUnits } from '../settings/useUnits';
import type { StageScreenProps } from '../workspace/stageScreens';
import { AddChipSheet } from './components/AddChipSheet';
import { ChipCard } from './components/ChipCard';
import {
  applicationWindowOf,
  chipGate,
  chipPlanFor,
  reminderAfterLayer,
  temperatureReadings,
  type EnteredTemp,
} from './model/chipPlan';
import '../prep/kit/stageKit.css';
import './chips.css';

const PAINT_KINDS = ['touch-up'];

/** The panel temperature typed on this screen, kept for the visit (this tab). */
function useEnteredTemp(jobId: string): [EnteredTemp | null, (t: EnteredTemp | null) => void] {
  const key = `panelpass-chip-temp-${jobId}`;
  const [entered, setEntered] = useState<EnteredTemp | null>(() => {
    try {
      const kept = JSON.parse(sessionStorage.getItem(key) ?? 'null') as EnteredTemp | null;
      return kept && typeof kept.tempC === 'number' && typeof kept.atMs === 'number' ? kept : null;
    } catch {
      return null;
    }
  });
  useEffect(() => {
    try {
      if (entered) sessionStorage.setItem(key, JSON.stringify(entered));
      else sessionStorage.removeItem(key);
    } catch {
      // Storage blocked: the temperature still holds while the screen is open.
    }
  }, [key, entered]);
  return [entered, setEntered];
}

/**
 * The Chips screen: each chip with its layers, the planner's next time in words and why,
 * and a one-tap Layer button that the climate gate blocks with its reasons. The temperature
 * comes from the job's climate readings, or one typed here. Touch-up cautions with the
 * paint's safety data sheet.
 */
export default function ChipsStage({ jobId }: StageScreenProps) {
  const { changes } = useChanges();
  const units = useUnits();
  const nowMs = useServerNow(5000);
  const chips = useJobRows('chips', jobId, 'number');
  const layers = useJobRows('chip_layers', jobId) ?? [];
  const panels = useJobRows('job_panels', jobId, 'position') ?? [];
  const timers = useJobRows('timers', jobId) ?? [];
  const paints = useProductsOfKinds(PAINT_KINDS) ?? [];
  const climate = useJobClimate(jobId) ?? [];
  const latest = climate.at(-1) ?? null;
  const [entered, setEntered] = useEnteredTemp(jobId);
  const [tempText, setTempText] = useState('');
  const [tempTried, setTempTried] = useState(false);
  const [adding, setAdding] = useState(false);

  const all = chips ?? [];
  const paintOf = (chip: ChipRow): ProductRow | undefined =>
    paints.find((p) => p.id === chip.productId);
  const layerTimes = (chipId: string) =>
    layers
      .filter((l) => l.chipId === chipId)
      .map((l) => Date.parse(l.appliedAt))
      .sort((a, b) => a - b);
  const readings = temperatureReadings(climate, entered);
  const paintsInUse = [...new Set(all.map((c) => c.productId))]
    .map((id) => paints.find((p) => p.id === id))
    .filter((p) => p !== undefined);
  const mainPaint = paintsInUse[0] ?? paints[0];

  function outcomeFor(chip: ChipRow, times: number[], at: number) {
    const paint = paintOf(chip);
    return chipPlanFor({
      layersAppliedAtMs: times,
      layersPlanned: chip.layersPlanned,
      paint: paint?.properties,
      paintName: paint?.name ?? null,
      readings,
      nowMs: at,
      unit: units.temperature,
    });
  }

  async function layerOn(chip: ChipRow) {
    const stored = await changes.addChipLayer({
      id: crypto.randomUUID(),
      chipId: chip.id,
      productId: chip.productId,
    });
    if (!stored) return;
    // A reminder for when this chip is next ready (the alarm and the Today screen read it).
    const applied = stored.args.appliedAt;
    const appliedAtMs = typeof applied === 'string' ? Date.parse(applied) : nowMs;
    const after = outcomeFor(chip, [...layerTimes(chip.id), appliedAtMs], appliedAtMs);
    const reminder =
      after.kind === 'plan' ? reminderAfterLayer(chip.number, after.plan, appliedAtMs) : null;
    for (const t of timers) {
      const live = t.cancelledAt === null && t.acknowledgedAt === null;
      if (live && t.subjectType === 'chip' && t.subjectId === chip.id) {
        await changes.cancelTimer({ id: t.id });
      }
    }
    if (reminder) {
      await changes.startTimer({
        id: crypto.randomUUID(),
        jobId,
        kind: 'cure',
        subjectType: 'chip',
        subjectId: chip.id,
        label: reminder.label,
        endsAt: new Date(reminder.endsAtMs).toISOString(),
      });
    }
  }

  const typed = parseDecimal(tempText);
  const typedC = typed === null ? null : units.toC(typed);
  const tempProblem =
    typedC === null
      ? 'Type the panel temperature (a number).'
      : typedC < -30 || typedC > 80
        ? 'That is not a panel temperature to paint at.'
        : null;

  const plans = all.map((chip) => ({
    chip,
    times: layerTimes(chip.id),
    outcome: outcomeFor(chip, layerTimes(chip.id), nowMs),
  }));
  const readyNow = plans.filter(
    ({ outcome }) => outcome.kind === 'plan' && outcome.plan.status === 'ready-for-next-layer',
  ).length;
  const nextTimes = plans
    .map(({ outcome }) => (outcome.kind === 'plan' ? outcome.plan.nextLayerAtMs : null))
    .filter((t): t is number => t !== null && t > nowMs)
    .sort((a, b) => a - b);

  return (
    <section className="pp-stage" aria-label="Chips">
      <div className="pp-stage-section">
        <div className="pp-stage-section__head">
          <h2 id="pp-chips-title" className="pp-stage-section__title">
            Chips
          </h2>
          <span className="pp-stage-section__count">
            {all.length} {all.length === 1 ? 'chip' : 'chips'} · {readyNow} ready now
            {nextTimes[0] !== undefined ? ` · next at ${clockTime(nextTimes[0])}` : ''}
          </span>
        </div>
      </div>

      <ClimateCard
        jobId={jobId}
        product={applicationWindowOf(mainPaint?.properties)}
        {...(mainPaint ? { productName: mainPaint.name } : {})}
      />

      <section className="pp-stage-section" aria-label="Each chip">
        {chips !== undefined && all.length === 0 ? (
          <p className="pp-stage-muted">No chips on this job yet.</p>
        ) : null}
        {plans.map(({ chip, times, outcome }) => {
          const paint = paintOf(chip);
          return (
            <ChipCard
              key={chip.id}
              chip={chip}
              layersDone={times.length}
              paint={paint}
              panelLabel={panels.find((p) => p.id === chip.panelId)?.label ?? null}
              outcome={outcome}
              gate={chipGate({
                latest,
                entered,
                window: applicationWindowOf(paint?.properties),
                nowMs,
                unit: units.temperature,
              })}
              nowMs={nowMs}
              onLayer={() => void layerOn(chip)}
            />
          );
        })}
        <button
          type="button"
          className="pp-button pp-button--quiet"
          onClick={() => setAdding(true)}
        >
          Add chip
        </button>
      </section>

      <section className="pp-stage-section pp-chip-temp" aria-labelledby="pp-chip-temp-title">
        <h2 id="pp-chip-temp-title" className="pp-stage-section__title">
          Panel temperature for the planner
        </h2>
        {entered ? (
          <p className="pp-stage-muted">
            Using {units.formatTemp(entered.tempC)}, typed at {clockTime(entered.atMs)}, after the
            climate readings.
          </p>
        ) : (
          <p className="pp-stage-muted">
            {latest
              ? 'The planner uses the climate readings. Type a panel temperature to add one now.'
              : 'No climate reading yet: type the panel temperature so the layers can be planned.'}
          </p>
        )}
        <div className="pp-chip-temp__row">
          <TextField
            label={`Panel now (${units.temperatureSymbol})`}
            inputMode="decimal"
            autoComplete="off"
            value={tempText}
            placeholder={latest ? decimalText(units.fromC(latest.surfaceC ?? latest.airC)) : ''}
            onChange={(e) => setTempText(e.target.value)}
            problem={tempTried ? tempProblem : null}
          />
          <button
            type="button"
            className="pp-button pp-button--quiet pp-button--compact"
            onClick={() => {
              setTempTried(true);
              if (typedC === null || tempProblem) return;
              setEntered({ tempC: typedC, atMs: nowMs });
              setTempText('');
              setTempTried(false);
            }}
          >
            Use it
          </button>
          {entered ? (
            <button
              type="button"
              className="pp-button pp-button--quiet pp-button--compact"
              onClick={() => setEntered(null)}
            >
              Stop using {units.formatTemp(entered.tempC)}
            </button>
          ) : null}
        </div>
      </section>

      <ProductCautions
        kind="touch-up"
        products={(paintsInUse.length ? paintsInUse : paints).map((p) => ({
          name: p.name,
          sdsUrl: p.sdsUrl,
        }))}
      />

      <AddChipSheet
        jobId={jobId}
        isOpen={adding}
        onClose={() => setAdding(false)}
        panels={panels}
        paints={paints}
        lastPanelId={all.at(-1)?.panelId ?? null}
        lastPaintId={all.at(-1)?.productId ?? null}
      />
    </section>
  );
}
