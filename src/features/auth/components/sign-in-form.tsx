import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router';
import { ApiProblem } from '../../../api/problem.ts';
import { Button } from '../../../components/ui/button.tsx';
import { ProblemAlert } from '../../../components/ui/feedback.tsx';
import { TextField } from '../../../components/ui/field.tsx';
import { useLogin } from '../api/session.ts';
import { paths } from '../../../config/paths.ts';

/** Only same-site paths are followed after sign-in. */
function safeNext(next: string | null): string {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : '/';
}

export function SignInForm() {
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const login = useLogin();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const problem = login.error instanceof ApiProblem ? login.error : undefined;

  function submit(event: FormEvent) {
    event.preventDefault();
    login.mutate({ email, password }, { onSuccess: () => navigate(safeNext(params.get('next')), { replace: true }) });
  }

  return (
    <form onSubmit={submit} className="space-y-4" noValidate>
      <ProblemAlert error={login.error} fields={['email', 'password']} />
      <TextField
        label="E-mail"
        type="email"
        name="email"
        autoComplete="username"
        required
        value={email}
        onChange={(e) => setEmail(e.target.value)}
        error={problem?.fieldError('email')}
      />
      <TextField
        label="Password"
        type="password"
        name="password"
        autoComplete="current-password"
        required
        value={password}
        onChange={(e) => setPassword(e.target.value)}
        error={problem?.fieldError('password')}
      />
      <Button type="submit" className="w-full" disabled={login.isPending}>
        {login.isPending ? 'Signing in…' : 'Sign in'}
      </Button>
      <p className="text-center text-sm">
        <Link to={paths.resetPassword} className="text-copper-700 underline-offset-2 hover:underline">
          Forgot your password?
        </Link>
      </p>
    </form>
  );
}
