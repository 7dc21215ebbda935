import { useState, type FormEvent } from 'react';
import { Notice } from '../../../components/Notice';
import { PasswordField } from '../../../components/PasswordField';
import { TextField } from '../../../components/TextField';
import { newPasswordMinLength, newPasswordProblem, requiredProblem } from '../model/formChecks';

interface InviteAcceptFormProps {
  onSubmit: (input: { name: string; password: string }) => void;
  pending: boolean;
  error: string | null;
}

export function InviteAcceptForm({ onSubmit, pending, error }: InviteAcceptFormProps) {
  const [name, setName] = useState('');
  const [password, setPassword] = useState('');
  const [checked, setChecked] = useState(false);

  const problems = {
    name: requiredProblem(name, 'your name'),
    password: newPasswordProblem(password),
  };

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setChecked(true);
    if (problems.name || problems.password || pending) return;
    onSubmit({ name: name.trim(), password });
  }

  return (
    <form className="pp-form" noValidate onSubmit={submit} aria-label="Accept the invite">
      <TextField
        label="Your name"
        name="name"
        autoComplete="name"
        hint="As the owner and customers will see it."
        value={name}
        onChange={(e) => setName(e.target.value)}
        problem={checked ? problems.name : null}
      />
      <PasswordField
        label="Choose a password"
        name="password"
        autoComplete="new-password"
        hint={`At least ${newPasswordMinLength} characters.`}
        value={password}
        onChange={(e) => setPassword(e.target.value)}
        problem={checked ? problems.password : null}
      />
      {error ? <Notice tone="stop">{error}</Notice> : null}
      <div className="pp-actions">
        <button className="pp-button" type="submit" disabled={pending} aria-busy={pending}>
          {pending ? 'Joining…' : 'Join and sign in'}
        </button>
      </div>
    </form>
  );
}
