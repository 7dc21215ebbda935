import { useEffect, useRef, useState } from 'react';
import type uPlot from 'uplot';
import type { ProfitSeries } from '../model/ledgerModel';

/** Colours from the theme, read when drawing so the dark theme gets its own. */
function themeColour(name: string, fallback: string): string {
  const value = getComputedStyle(document.documentElement).getPropertyValue(name).trim();
  return value || fallback;
}

/**
 * Profit per month as bars (uPlot, loaded only when the Ledger draws it, so it never weighs
 * on the sign-in or Today screens). A picture only: the table beside it holds the same
 * numbers in words, and `summary` is its text alternative.
 */
export function ProfitChart({
  series,
  formatValue,
}: {
  series: ProfitSeries;
  formatValue: (value: number) => string;
}) {
  const host = useRef<HTMLDivElement>(null);
  const [failed, setFailed] = useState(false);

  useEffect(() => {
    const el = host.current;
    if (!el) return;
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
        const go = themeColour('--pp-go', '#00626b');
        const line = themeColour('--pp-line', '#3a4657');
        const width = () => Math.max(240, el.clientWidth);
        const bars = UPlot.paths.bars?.({ size: [0.6, 64], align: 0 });
        chart = new UPlot(
          {
            width: width(),
            height: 220,
            legend: { show: false },
            cursor: { show: false },
            select: { show: false, left: 0, top: 0, width: 0, height: 0 },
            scales: {
              x: { time: false, range: [-0.5, series.x.length - 0.5] },
              y: {
                range: (_u, min, max) => [Math.min(0, min), Math.max(0, max) || 1],
              },
            },
            axes: [
              {
                stroke: ink,
                grid: { show: false },
                ticks: { stroke: line },
                splits: () => series.x,
                values: (_u, splits) => splits.map((i) => series.labels[i] ?? ''),
              },
              {
                stroke: ink,
                size: 72,
                grid: { stroke: line, width: 0.5 },
                ticks: { stroke: line },
                values: (_u, splits) => splits.map((v) => formatValue(v)),
              },
            ],
            series: [
              {},
              {
                label: 'Profit',
                stroke: go,
                fill: go,
                width: 0,
                points: { show: false },
                ...(bars ? { paths: bars } : {}),
              },
            ],
          },
          [series.x, series.profit],
          el,
        );
        observer = new ResizeObserver(() => chart?.setSize({ width: width(), height: 220 }));
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
  }, [series, formatValue]);

  return (
    <figure className="pp-ledger-chart">
      <div ref={host} className="pp-ledger-chart__plot" role="img" aria-label={series.summary} />
      {failed ? (
        <figcaption>The chart could not be drawn; the table below has the same figures.</figcaption>
      ) : null}
    </figure>
  );
}
