import { useState, type FormEvent } from 'react';
import { ApiProblem } from '../../../api/problem.ts';
import { Button } from '../../../components/ui/button.tsx';
import { ProblemAlert } from '../../../components/ui/feedback.tsx';
import { TextField } from '../../../components/ui/field.tsx';

/** Shared by invitation acceptance and password reset: a new password, typed twice. */
export function ChoosePasswordForm({
  submitLabel,
  pending,
  error,
  onSubmit,
}: {
  submitLabel: string;
  pending: boolean;
  error: Error | null;
  onSubmit: (password: string) => void;
}) {
  const [password, setPassword] = useState('');
  const [repeat, setRepeat] = useState('');
  const [mismatch, setMismatch] = useState(false);
  const problem = error instanceof ApiProblem ? error : undefined;

  function submit(event: FormEvent) {
    event.preventDefault();
    setMismatch(password !== repeat);
    if (password === repeat) onSubmit(password);
  }

  return (
    <form onSubmit={submit} className="space-y-4" noValidate>
      <ProblemAlert error={error} fields={['password']} />
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        value={password}
        onChange={(e) => setPassword(e.target.value)}
        error={problem?.fieldError('password')}
        hint="At least 10 characters."
      />
      <TextField
        label="Repeat the password"
        type="password"
        autoComplete="new-password"
        value={repeat}
        onChange={(e) => setRepeat(e.target.value)}
        error={mismatch ? 'The two passwords differ.' : undefined}
      />
      <Button type="submit" className="w-full" disabled={pending}>
        {pending ? 'Saving…' : submitLabel}
      </Button>
    </form>
  );
}
