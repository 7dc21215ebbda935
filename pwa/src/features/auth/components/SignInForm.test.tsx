import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { SignInForm } from './SignInForm';

afterEach(cleanup);

function fill(label: RegExp, value: string) {
  fireEvent.change(screen.getByLabelText(label), { target: { value } });
}

describe('SignInForm', () => {
  it('sends the trimmed e-mail and the password', () => {
    const onSubmit = vi.fn();
    render(<SignInForm onSubmit={onSubmit} pending={false} error={null} />);

    fill(/e-mail/i, '  owner@heronwake.example ');
    fill(/^password$/i, 'detail-demo-1');
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(onSubmit).toHaveBeenCalledWith({
      email: 'owner@heronwake.example',
      password: 'detail-demo-1',
    });
  });

  it('says in words what is missing, and sends nothing', () => {
    const onSubmit = vi.fn();
    render(<SignInForm onSubmit={onSubmit} pending={false} error={null} />);

    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(screen.getByText('Type your e-mail address.')).toBeTruthy();
    expect(screen.getByText('Type your password.')).toBeTruthy();
    expect(screen.getByLabelText(/e-mail/i).getAttribute('aria-invalid')).toBe('true');
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('shows the server’s refusal as an alert in words', () => {
    render(
      <SignInForm
        onSubmit={vi.fn()}
        pending={false}
        error="That e-mail and password don't match. Check both and try again."
      />,
    );
    expect(screen.getByRole('alert').textContent).toMatch(/don't match/);
  });

  it('can show the password, for typing with gloves on', () => {
    render(<SignInForm onSubmit={vi.fn()} pending={false} error={null} />);
    const field = screen.getByLabelText(/^password$/i);
    expect(field.getAttribute('type')).toBe('password');

    fireEvent.click(screen.getByRole('button', { name: 'Show' }));

    expect(field.getAttribute('type')).toBe('text');
  });

  it('cannot be sent twice while signing in', () => {
    render(<SignInForm onSubmit={vi.fn()} pending error={null} />);
    const button = screen.getByRole('button', { name: /signing in/i });
    expect((button as HTMLButtonElement).disabled).toBe(true);
  });
});
