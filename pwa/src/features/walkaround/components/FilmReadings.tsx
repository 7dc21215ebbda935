import { useState } from 'react';
import { formatThickness, PANEL_BANDS, type ThicknessUnit } from '@panelpass/shared';
import { Glyph } from '../../../components/Glyph';
import type { WalkaroundData } from '../hooks/useWalkaround';
import {
  BAND_WORDS,
  bandOf,
  FLAG_WORDS,
  gaugeOf,
  SUBSTRATE_WORDS,
  type PanelFilm,
} from '../model/film';
import { ReadingSheet } from './ReadingSheet';

/** "2 spots · mean 112 µm" or what stands in its way. */
function measuredWords(p: PanelFilm, unit: ThicknessUnit): string {
  if (p.spots.length === 0) return 'Not measured';
  const spots = `${p.spots.length} ${p.spots.length === 1 ? 'spot' : 'spots'}`;
  if (!p.stats) return `${spots} · not valid on ${SUBSTRATE_WORDS[p.substrate].toLowerCase()}`;
  return `${spots} · mean ${formatThickness(Math.round(p.stats.meanUm * 10) / 10, unit)}`;
}

/**
 * Film thickness per panel, the panels top-down in their four bands. Each panel says its
 * spots, mean and flags (thin, probably repainted, probably filler) at once; tap one to add
 * a spot of readings.
 */
export function FilmReadings({ data, unit }: { data: WalkaroundData; unit: ThicknessUnit }) {
  const { film, readOnly, job } = data;
  const [open, setOpen] = useState<string | null>(null);
  const openPanel = film.panels.find((p) => p.panel.id === open) ?? null;
  const lastGauge =
    [...film.panels.flatMap((p) => p.spots)].sort((a, b) => b.takenAt.localeCompare(a.takenAt))[0]
      ?.gauge ?? null;
  const flagged = film.panels.filter((p) => p.flags && p.flags.flags.length > 0);

  return (
    <div className="pp-film">
      <p className="pp-section-hint">
        {film.baselineUm !== null
          ? `This car's usual film: ${formatThickness(Math.round(film.baselineUm * 10) / 10, unit)}, the middle of ${film.measuredPanels} metal panels. Each panel is compared with it.`
          : (film.reasons[0]?.message ??
            'No readings yet. Tap a panel to enter a spot of 3 or more gauge readings.')}
      </p>
      {flagged.length ? (
        <p className="pp-film__flagged" role="status">
          <Glyph name="alert" size={22} />
          <span>
            {flagged.length} {flagged.length === 1 ? 'panel needs' : 'panels need'} care:{' '}
            {flagged
              .map(
                (p) =>
                  `${p.panel.label} (${(p.flags?.flags ?? []).map((f) => FLAG_WORDS[f].toLowerCase()).join(', ')})`,
              )
              .join('; ')}
            .
          </span>
        </p>
      ) : null}
      {PANEL_BANDS.map((band) => {
        const inBand = film.panels.filter((p) => bandOf(p.panel.band) === band);
        if (inBand.length === 0) return null;
        return (
          <section key={band} className="pp-band" aria-labelledby={`pp-band-${band}`}>
            <h3 id={`pp-band-${band}`} className="pp-band__title">
              {BAND_WORDS[band]}
            </h3>
            <ul className="pp-band__panels">
              {inBand.map((p) => {
                const flags = p.flags?.flags ?? [];
                const notValid = p.spots.length > 0 && !p.stats;
                return (
                  <li key={p.panel.id}>
                    <button
                      type="button"
                      className={`pp-panel-row${flags.length || notValid ? ' pp-panel-row--flagged' : ''}`}
                      onClick={() => setOpen(p.panel.id)}
                    >
                      <span className="pp-panel-row__name">{p.panel.label}</span>
                      <span className="pp-panel-row__substrate">
                        {SUBSTRATE_WORDS[p.substrate]}
                      </span>
                      <span className="pp-panel-row__measure">{measuredWords(p, unit)}</span>
                      {flags.length || notValid ? (
                        <span className="pp-panel-row__flags">
                          <Glyph name="alert" size={20} />
                          {notValid
                            ? 'Reading not valid'
                            : flags.map((f) => FLAG_WORDS[f]).join(', ')}
                        </span>
                      ) : p.stats && film.baselineUm !== null ? (
                        <span className="pp-panel-row__ok">
                          <Glyph name="check" size={20} />
                          Like the rest of the car
                        </span>
                      ) : null}
                    </button>
                  </li>
                );
              })}
            </ul>
          </section>
        );
      })}
      <ReadingSheet
        jobId={job.id}
        panel={openPanel}
        film={film}
        defaultUnit={unit}
        lastGauge={gaugeOf(lastGauge ?? '')}
        readOnly={readOnly}
        onClose={() => setOpen(null)}
      />
    </div>
  );
}
