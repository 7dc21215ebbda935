/** A money amount typed with gloves on: a big decimal keypad field with its problem below. */
export function AmountField({
  id,
  label,
  value,
  problem,
  onChange,
}: {
  id: string;
  label: string;
  value: string;
  problem: string | null;
  onChange: (text: string) => void;
}) {
  return (
    <div className={`pp-field${problem ? ' pp-field--problem' : ''}`}>
      <label className="pp-field__label" htmlFor={id}>
        {label}
      </label>
      <div className="pp-field__control">
        <input
          id={id}
          className="pp-field__input"
          inputMode="decimal"
          autoComplete="off"
          value={value}
          aria-invalid={problem ? true : undefined}
          aria-describedby={problem ? `${id}-problem` : undefined}
          onChange={(e) => onChange(e.target.value)}
        />
      </div>
      {problem ? (
        <p id={`${id}-problem`} className="pp-field__problem">
          {problem}
        </p>
      ) : null}
    </div>
  );
}
