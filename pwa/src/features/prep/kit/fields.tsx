import { useId, type ReactNode, type TextareaHTMLAttributes } from 'react';

/**
 * Form controls of the stage screens, each labelled for screen readers, at least 56 px tall
 * and usable with a gloved thumb: a native select, a row of big radio choices, a − n +
 * stepper and a note box. Numbers are typed with TextField and inputMode="decimal".
 */

export interface Option {
  value: string;
  label: string;
}

export function SelectField({
  label,
  value,
  options,
  onChange,
  emptyLabel,
  hint,
}: {
  label: string;
  value: string;
  options: readonly Option[];
  onChange: (value: string) => void;
  /** When given, a first choice with value '' ("None", "Pick a panel"). */
  emptyLabel?: string;
  hint?: string;
}) {
  const id = useId();
  return (
    <div className="pp-field">
      <label className="pp-field__label" htmlFor={id}>
        {label}
      </label>
      {hint ? (
        <p className="pp-field__hint" id={`${id}-hint`}>
          {hint}
        </p>
      ) : null}
      <div className="pp-field__control">
        <select
          id={id}
          className="pp-field__input pp-stage-select"
          value={value}
          aria-describedby={hint ? `${id}-hint` : undefined}
          onChange={(e) => onChange(e.target.value)}
        >
          {emptyLabel !== undefined ? <option value="">{emptyLabel}</option> : null}
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      </div>
    </div>
  );
}

/** One choice out of a few, as big buttons in a row (native radios underneath). */
export function ChoiceField({
  label,
  value,
  options,
  onChange,
  columns,
}: {
  label: string;
  value: string;
  options: readonly (Option & { icon?: ReactNode })[];
  onChange: (value: string) => void;
  /** How many choices side by side; they wrap onto more rows with large text. */
  columns?: number;
}) {
  const name = useId();
  return (
    <fieldset className="pp-stage-choices">
      <legend className="pp-field__label">{label}</legend>
      <div
        className="pp-stage-choices__row"
        style={{
          gridTemplateColumns: `repeat(auto-fit, minmax(${columns ? 18 / columns : 7}rem, 1fr))`,
        }}
      >
        {options.map((o) => (
          <label key={o.value} className="pp-stage-choice">
            <input
              type="radio"
              name={name}
              value={o.value}
              checked={value === o.value}
              onChange={() => onChange(o.value)}
            />
            <span className="pp-stage-choice__face">
              {o.icon}
              {o.label}
            </span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}

/** A whole number with − and + buttons (passes, layers), typed or tapped. */
export function StepperField({
  label,
  value,
  onChange,
  min,
  max,
  unit,
}: {
  label: string;
  value: number;
  onChange: (value: number) => void;
  min: number;
  max: number;
  /** Words after the number for screen readers, e.g. "passes". */
  unit: string;
}) {
  const id = useId();
  const clamp = (n: number) => Math.min(max, Math.max(min, n));
  return (
    <div className="pp-field">
      <label className="pp-field__label" htmlFor={id}>
        {label}
      </label>
      <div className="pp-stepper">
        <button
          type="button"
          className="pp-stepper__button"
          aria-label={`One fewer ${unit}`}
          disabled={value <= min}
          onClick={() => onChange(clamp(value - 1))}
        >
          −
        </button>
        <input
          id={id}
          className="pp-stepper__value"
          type="text"
          inputMode="numeric"
          pattern="[0-9]*"
          value={String(value)}
          onChange={(e) => {
            const n = Number.parseInt(e.target.value, 10);
            if (Number.isFinite(n)) onChange(clamp(n));
          }}
        />
        <button
          type="button"
          className="pp-stepper__button"
          aria-label={`One more ${unit}`}
          disabled={value >= max}
          onClick={() => onChange(clamp(value + 1))}
        >
          +
        </button>
      </div>
    </div>
  );
}

/** A note of a few lines. */
export function NoteField({
  label,
  hint,
  ...area
}: { label: string; hint?: string } & Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id'>) {
  const id = useId();
  return (
    <div className="pp-field">
      <label className="pp-field__label" htmlFor={id}>
        {label}
      </label>
      {hint ? (
        <p className="pp-field__hint" id={`${id}-hint`}>
          {hint}
        </p>
      ) : null}
      <div className="pp-field__control">
        <textarea
          {...area}
          id={id}
          rows={area.rows ?? 3}
          className="pp-field__input pp-note"
          aria-describedby={hint ? `${id}-hint` : undefined}
        />
      </div>
    </div>
  );
}
