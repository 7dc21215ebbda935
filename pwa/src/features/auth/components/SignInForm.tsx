import { useState, type FormEvent } from 'react';
import { Notice } from '../../../components/Notice';
import { PasswordField } from '../../../components/PasswordField';
import { TextField } from '../../../components/TextField';
import type { SignInInput } from '../api/authApi';
import { emailProblem, passwordProblem } from '../model/formChecks';

interface SignInFormProps {
  onSubmit: (input: SignInInput) => void;
  pending: boolean;
  /** Why the last try failed, in words. */
  error: string | null;
}

export function SignInForm({ onSubmit, pending, error }: SignInFormProps) {
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [checked, setChecked] = useState(false);

  const problems = { email: emailProblem(email), password: passwordProblem(password) };

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setChecked(true);
    if (problems.email || problems.password || pending) return;
    onSubmit({ email: email.trim(), password });
  }

  return (
    <form className="pp-form" noValidate onSubmit={submit} aria-label="Sign in">
      <TextField
        label="E-mail"
        name="email"
        type="email"
        inputMode="email"
        autoComplete="username"
        autoCapitalize="none"
        autoCorrect="off"
        spellCheck={false}
        value={email}
        onChange={(e) => setEmail(e.target.value)}
        problem={checked ? problems.email : null}
      />
      <PasswordField
        label="Password"
        name="password"
        autoComplete="current-password"
        value={password}
        onChange={(e) => setPassword(e.target.value)}
        problem={checked ? problems.password : null}
      />
      {error ? <Notice tone="stop">{error}</Notice> : null}
      <div className="pp-actions">
        <button className="pp-button" type="submit" disabled={pending} aria-busy={pending}>
          {pending ? 'Signing in…' : 'Sign in'}
        </button>
      </div>
    </form>
  );
}
