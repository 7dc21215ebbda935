import { useState, type InputHTMLAttributes } from 'react';
import { Glyph } from './Glyph';
import { TextField } from './TextField';

interface PasswordFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'type' | 'id'> {
  label: string;
  problem?: string | null;
  hint?: string;
}

/** A password field with a large Show/Hide button: typing with gloves on goes wrong. */
export function PasswordField(props: PasswordFieldProps) {
  const [shown, setShown] = useState(false);
  return (
    <TextField
      {...props}
      type={shown ? 'text' : 'password'}
      autoCapitalize="none"
      autoCorrect="off"
      spellCheck={false}
      trailing={
        <button
          type="button"
          className="pp-field__toggle"
          aria-pressed={shown}
          onClick={() => setShown((value) => !value)}
        >
          <Glyph name={shown ? 'eye-off' : 'eye'} />
          <span>{shown ? 'Hide' : 'Show'}</span>
        </button>
      }
    />
  );
}
