import { useEffect, useRef, useState } from 'react';
import type uPlot from 'uplot';
import type { ReadingsHistory } from '../model/readings';

/** Colours from the theme, read when drawing so the dark theme gets its own. */
function themeColour(name: string, fallback: string): string {
  const value = getComputedStyle(document.documentElement).getPropertyValue(name).trim();
  return value || fallback;
}

/** Line colours and dash patterns: neighbouring panels differ in both, not colour alone. */
const PALETTE = ['#00626b', '#8a4b00', '#6b2fa3', '#185c32', '#a3001b', '#1f4fbf', '#5c5c00'];
const DASHES: number[][] = [[], [8, 4], [2, 3]];

/**
 * Each panel's film thickness over the vehicle's visits as lines (uPlot, loaded only when a
 * vehicle's history is opened, so it never weighs on the sign-in or Today screens). A
 * picture only: `summary` is its text alternative and the table below has every number.
 */
export function ReadingsChart({
  history,
  summary,
  fromUm,
  unitSymbol,
}: {
  history: ReadingsHistory;
  summary: string;
  /** µm → the business's unit. */
  fromUm: (um: number) => number;
  unitSymbol: string;
}) {
  const host = useRef<HTMLDivElement>(null);
  const [failed, setFailed] = useState(false);

  useEffect(() => {
    const el = host.current;
    if (!el || history.visits.length === 0) return;
    let chart: uPlot | null = null;
    let observer: ResizeObserver | null = null;
    let cancelled = false;
    void (async () => {
      try {
        const [{ default: UPlot }] = await Promise.all([
          import('uplot'),
          import('uplot/dist/uPlot.min.css'),
        ]);
        if (cancelled) return;
        const ink = themeColour('--pp-ink-2', '#3a4657');
        const line = themeColour('--pp-line', '#3a4657');
        const width = () => Math.max(240, el.clientWidth);
        const xs = history.visits.map((v) => v.atMs / 1000);
        const day = 86_400;
        const [first, last] = [xs[0]!, xs[xs.length - 1]!];
        const pad = last - first < day ? day : (last - first) * 0.05;
        chart = new UPlot(
          {
            width: width(),
            height: 260,
            legend: { show: true, live: false },
            cursor: { show: false },
            select: { show: false, left: 0, top: 0, width: 0, height: 0 },
            scales: {
              x: { time: true, range: [first - pad, last + pad] },
              y: {
                range: (_u, min, max) => [
                  Math.max(0, Math.floor((min - 10) / 10) * 10),
                  Math.ceil((max + 10) / 10) * 10,
                ],
              },
            },
            axes: [
              {
                stroke: ink,
                grid: { show: false },
                ticks: { stroke: line },
                // Whole days at least, in the phone's own words ("3 May"), not uPlot's US style.
                incrs: [1, 2, 7, 14, 30, 91, 182, 365].map((d) => d * 86_400),
                values: (_u, splits) =>
                  splits.map((s) =>
                    new Date(s * 1000).toLocaleDateString(undefined, {
                      day: 'numeric',
                      month: 'short',
                    }),
                  ),
              },
              {
                stroke: ink,
                size: 64,
                label: unitSymbol,
                grid: { stroke: line, width: 0.5 },
                ticks: { stroke: line },
              },
            ],
            series: [
              {},
              ...history.panels.map((p, i) => ({
                label: p.label,
                stroke: PALETTE[i % PALETTE.length]!,
                dash: DASHES[Math.floor(i / PALETTE.length) % DASHES.length]!,
                width: 2,
                spanGaps: true,
                points: { show: true, size: 8 },
              })),
            ],
          },
          [xs, ...history.panels.map((p) => p.values.map((v) => (v === null ? null : fromUm(v))))],
          el,
        );
        observer = new ResizeObserver(() => chart?.setSize({ width: width(), height: 260 }));
        observer.observe(el);
      } catch {
        if (!cancelled) setFailed(true);
      }
    })();
    return () => {
      cancelled = true;
      observer?.disconnect();
      chart?.destroy();
    };
  }, [history, fromUm, unitSymbol]);

  return (
    <figure className="pp-office-chart" style={{ margin: 0 }}>
      <div ref={host} role="img" aria-label={summary} data-testid="readings-chart" />
      <figcaption className="pp-field__hint">
        {failed ? 'The chart could not be drawn; the table below has the same numbers.' : summary}
      </figcaption>
    </figure>
  );
}
