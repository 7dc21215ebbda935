import { useState, type FormEvent } from 'react';
import { Notice } from '../../../components/Notice';
import { PasswordField } from '../../../components/PasswordField';
import { TextField } from '../../../components/TextField';
import type { SignUpInput } from '../api/authApi';
import {
  emailProblem,
  newPasswordMinLength,
  newPasswordProblem,
  requiredProblem,
} from '../model/formChecks';

interface SignUpFormProps {
  onSubmit: (input: SignUpInput) => void;
  pending: boolean;
  error: string | null;
}

export function SignUpForm({ onSubmit, pending, error }: SignUpFormProps) {
  const [businessName, setBusinessName] = useState('');
  const [name, setName] = useState('');
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [checked, setChecked] = useState(false);

  const problems = {
    businessName: requiredProblem(businessName, "your business's name"),
    name: requiredProblem(name, 'your name'),
    email: emailProblem(email),
    password: newPasswordProblem(password),
  };

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setChecked(true);
    if (Object.values(problems).some(Boolean) || pending) return;
    onSubmit({
      businessName: businessName.trim(),
      name: name.trim(),
      email: email.trim(),
      password,
    });
  }

  return (
    <form className="pp-form" noValidate onSubmit={submit} aria-label="Start a new business">
      <TextField
        label="Business name"
        name="businessName"
        autoComplete="organization"
        value={businessName}
        onChange={(e) => setBusinessName(e.target.value)}
        problem={checked ? problems.businessName : null}
      />
      <TextField
        label="Your name"
        name="name"
        autoComplete="name"
        value={name}
        onChange={(e) => setName(e.target.value)}
        problem={checked ? problems.name : null}
      />
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
        autoComplete="new-password"
        hint={`At least ${newPasswordMinLength} characters.`}
        value={password}
        onChange={(e) => setPassword(e.target.value)}
        problem={checked ? problems.password : null}
      />
      {error ? <Notice tone="stop">{error}</Notice> : null}
      <div className="pp-actions">
        <button className="pp-button" type="submit" disabled={pending} aria-busy={pending}>
          {pending ? 'Starting…' : 'Start my business'}
        </button>
      </div>
    </form>
  );
}
