import { useId, type ReactNode, type SelectHTMLAttributes } from 'react';
import { Glyph } from '../../../components/Glyph';

/** A problem said under a field or a list, tied to it for screen readers by its id. */
export function Problem({ id, children }: { id?: string; children: ReactNode }) {
  return (
    <p className="pp-field__problem" id={id}>
      <Glyph name="alert" size={20} />
      <span>{children}</span>
    </p>
  );
}

/**
 * A set of choices as large radio rows; each choice may carry a line of explanation under
 * its words.
 */
export function ChoiceGroup<T extends string>({
  legend,
  name,
  value,
  choices,
  onChange,
}: {
  legend: string;
  name: string;
  value: T;
  choices: readonly { value: T; words: string; line?: string }[];
  onChange: (value: T) => void;
}) {
  return (
    <fieldset className="pp-settings__choice">
      <legend className="pp-field__label">{legend}</legend>
      {choices.map((c) => (
        <label key={c.value} className="pp-settings__option">
          <input
            type="radio"
            name={name}
            value={c.value}
            checked={value === c.value}
            onChange={() => onChange(c.value)}
          />
          <span className="pp-settings__option-words">
            <span>{c.words}</span>
            {c.line ? <span className="pp-settings__option-line">{c.line}</span> : null}
          </span>
        </label>
      ))}
    </fieldset>
  );
}

/** A labelled native select (the phone's own picker), as tall as a text field. */
export function SelectField({
  label,
  options,
  ...select
}: Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> & {
  label: string;
  options: readonly { value: string; words: string }[];
}) {
  const id = useId();
  return (
    <div className="pp-field">
      <label className="pp-field__label" htmlFor={id}>
        {label}
      </label>
      <div className="pp-field__control">
        <select {...select} id={id} className="pp-field__input pp-settings__select">
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.words}
            </option>
          ))}
        </select>
      </div>
    </div>
  );
}

/** A yes/no as a large checkbox row. */
export function CheckField({
  label,
  checked,
  onChange,
}: {
  label: string;
  checked: boolean;
  onChange: (checked: boolean) => void;
}) {
  return (
    <label className="pp-settings__option pp-settings__check">
      <input type="checkbox" checked={checked} onChange={(e) => onChange(e.target.checked)} />
      <span>{label}</span>
    </label>
  );
}

/** One part of the Settings screen, with its heading for the page's outline. */
export function SettingsSection({
  id,
  title,
  lead,
  children,
}: {
  id: string;
  title: string;
  lead?: ReactNode;
  children: ReactNode;
}) {
  const headingId = `${id}-heading`;
  return (
    <section className="pp-settings__section" id={id} aria-labelledby={headingId}>
      <h2 className="pp-settings__heading" id={headingId}>
        {title}
      </h2>
      {lead ? <p className="pp-settings__note">{lead}</p> : null}
      {children}
    </section>
  );
}
