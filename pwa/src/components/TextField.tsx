import { useId, type InputHTMLAttributes, type ReactNode } from 'react';
import { Glyph } from './Glyph';

interface TextFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> {
  label: string;
  /** Shown under the field: what is wrong with it, in words. */
  problem?: string | null;
  hint?: string;
  /** Something to place at the end of the input, e.g. a show-password button. */
  trailing?: ReactNode;
}

/** A labelled input, 56 px tall, with its problem said under it and tied to it for screen readers. */
export function TextField({ label, problem, hint, trailing, ...input }: TextFieldProps) {
  const id = useId();
  const hintId = `${id}-hint`;
  const problemId = `${id}-problem`;
  const describedBy = [hint ? hintId : null, problem ? problemId : null].filter(Boolean).join(' ');

  return (
    <div className={`pp-field${problem ? ' pp-field--problem' : ''}`}>
      <label className="pp-field__label" htmlFor={id}>
        {label}
      </label>
      {hint ? (
        <p className="pp-field__hint" id={hintId}>
          {hint}
        </p>
      ) : null}
      <div className="pp-field__control">
        <input
          {...input}
          id={id}
          className="pp-field__input"
          aria-invalid={problem ? true : undefined}
          aria-describedby={describedBy || undefined}
        />
        {trailing}
      </div>
      {problem ? (
        <p className="pp-field__problem" id={problemId}>
          <Glyph name="alert" size={20} />
          <span>{problem}</span>
        </p>
      ) : null}
    </div>
  );
}
