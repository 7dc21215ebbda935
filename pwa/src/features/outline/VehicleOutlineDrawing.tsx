import { useId, type MouseEvent } from 'react';
import { panelAt, toFraction, vehicleOutline, type OutlineRegion } from './vehicleOutline';
import './outline.css';

export interface OutlinePin {
  id: string;
  number: number;
  x: number;
  y: number;
  severity: number;
  /** Not saved yet (the sheet is open): drawn with a dashed ring. */
  pending?: boolean;
}

/**
 * The vehicle outline with its damage pins. A tap reports where (fractions 0..1 of the
 * drawing) and which panel it hit. The drawing is for eyes and fingers; the pin list under it
 * and the "add by panel" button give the same to screen readers and keyboards.
 */
export function VehicleOutlineDrawing({
  bodyStyle,
  pins,
  description,
  marked,
  onTap,
}: {
  bodyStyle: string;
  pins: readonly OutlinePin[];
  /** Panels to mark (e.g. flagged by the film readings): a thick frame and a "!" corner. */
  marked?: ReadonlySet<string>;
  /** What the drawing shows, in words (read by screen readers instead of the drawing). */
  description: string;
  onTap?: (at: { x: number; y: number; panelKey: string | null }) => void;
}) {
  const outline = vehicleOutline(bodyStyle);
  const glass = `pp-glass-${useId().replace(/:/g, '')}`;

  function tapped(event: MouseEvent<SVGSVGElement>) {
    if (!onTap) return;
    const box = event.currentTarget.getBoundingClientRect();
    if (box.width === 0 || box.height === 0) return;
    const x = toFraction((event.clientX - box.left) / box.width);
    const y = toFraction((event.clientY - box.top) / box.height);
    onTap({ x, y, panelKey: panelAt(outline, x, y) });
  }

  return (
    <figure className="pp-outline">
      <div className="pp-outline__ends" aria-hidden="true">
        <span>Left</span>
        <span className="pp-outline__front">▲ Front</span>
        <span>Right</span>
      </div>
      <svg
        className={`pp-outline__svg${onTap ? ' pp-outline__svg--tappable' : ''}`}
        viewBox={`0 0 ${outline.width} ${outline.height}`}
        role="img"
        aria-label={description}
        onClick={tapped}
      >
        <defs>
          <pattern id={glass} width="3" height="3" patternUnits="userSpaceOnUse">
            <path d="M0 3 3 0" className="pp-outline__glass-line" />
          </pattern>
        </defs>
        {outline.regions.map((r, i) => (
          <Region
            key={`${r.panelKey ?? r.kind}-${i}`}
            region={r}
            glassFill={`url(#${glass})`}
            marked={r.panelKey !== null && (marked?.has(r.panelKey) ?? false)}
          />
        ))}
        {outline.wheels.map((w, i) => (
          <Wheel key={i} cx={w.cx} cy={w.cy} r={w.r} inward={w.cx < outline.width / 2} />
        ))}
        {pins.map((pin) => (
          <Pin key={pin.id} pin={pin} width={outline.width} height={outline.height} />
        ))}
      </svg>
      <div className="pp-outline__ends" aria-hidden="true">
        <span />
        <span>Rear</span>
        <span />
      </div>
    </figure>
  );
}

function Region({
  region: r,
  glassFill,
  marked,
}: {
  region: OutlineRegion;
  glassFill: string;
  marked: boolean;
}) {
  return (
    <g>
      <rect
        className={`pp-outline__region pp-outline__region--${r.kind}${marked ? ' pp-outline__region--marked' : ''}`}
        x={r.x}
        y={r.y}
        width={r.w}
        height={r.h}
        rx={r.rx}
        {...(r.kind === 'glass' ? { fill: glassFill } : {})}
        data-panel={r.panelKey ?? undefined}
      />
      {marked && r.w >= 10 ? (
        <g className="pp-outline__mark">
          <path d={`M${r.x + r.w - 6.5} ${r.y + 7} l3.2 -5.6 l3.2 5.6 Z`} />
          <text x={r.x + r.w - 3.3} y={r.y + 6.3}>
            !
          </text>
        </g>
      ) : null}
      {r.label ? (
        <text className="pp-outline__label" x={r.x + r.w / 2} y={r.y + r.h / 2} dy="0.35em">
          {r.label}
        </text>
      ) : null}
    </g>
  );
}

/** Half a wheel showing at the side's outer edge (the side lies flat, rocker outwards). */
function Wheel({ cx, cy, r, inward }: { cx: number; cy: number; r: number; inward: boolean }) {
  const sweep = inward ? 1 : 0;
  return (
    <path
      className="pp-outline__wheel"
      d={`M${cx} ${cy - r} A${r} ${r} 0 0 ${sweep} ${cx} ${cy + r} Z`}
    />
  );
}

function Pin({ pin, width, height }: { pin: OutlinePin; width: number; height: number }) {
  const cx = pin.x * width;
  const cy = pin.y * height;
  return (
    <g className={`pp-outline__pin${pin.pending ? ' pp-outline__pin--pending' : ''}`}>
      {pin.severity >= 3 ? (
        <circle className="pp-outline__pin-ring" cx={cx} cy={cy} r={6.2} />
      ) : null}
      <circle className="pp-outline__pin-dot" cx={cx} cy={cy} r={4.6} />
      <text className="pp-outline__pin-number" x={cx} y={cy} dy="0.35em">
        {pin.pending ? '+' : pin.number}
      </text>
    </g>
  );
}
