import { useState, type FormEvent } from 'react';
import { Link, useSearchParams } from 'react-router';
import { ApiProblem } from '../../api/problem.ts';
import { Button } from '../../components/ui/button.tsx';
import { Alert, ProblemAlert } from '../../components/ui/feedback.tsx';
import { TextField } from '../../components/ui/field.tsx';
import { useConfirmPasswordReset, useRequestPasswordReset } from '../../features/auth/api/session.ts';
import { AuthFrame } from '../../features/auth/components/auth-frame.tsx';
import { ChoosePasswordForm } from '../../features/auth/components/choose-password-form.tsx';
import { paths } from '../../config/paths.ts';

function RequestResetForm() {
  const [email, setEmail] = useState('');
  const request = useRequestPasswordReset();
  const problem = request.error instanceof ApiProblem ? request.error : undefined;
  if (request.isSuccess) {
    return (
      <Alert tone="success" title="Check your mailbox">
        If {email} belongs to an active account, a reset link is on its way. It is valid for 60 minutes.
      </Alert>
    );
  }
  function submit(event: FormEvent) {
    event.preventDefault();
    request.mutate({ email });
  }
  return (
    <form onSubmit={submit} className="space-y-4" noValidate>
      <ProblemAlert error={request.error} fields={['email']} />
      <TextField
        label="E-mail"
        type="email"
        autoComplete="username"
        value={email}
        onChange={(e) => setEmail(e.target.value)}
        error={problem?.fieldError('email')}
      />
      <Button type="submit" className="w-full" disabled={request.isPending}>
        Send me a reset link
      </Button>
    </form>
  );
}

export function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token');
  const confirm = useConfirmPasswordReset();
  return (
    <AuthFrame title={token ? 'Choose a new password' : 'Reset your password'}>
      {!token && <RequestResetForm />}
      {token && confirm.isSuccess && (
        <Alert tone="success" title="Your password is changed">
          <Link to={paths.signIn} className="text-copper-700 underline">
            Sign in
          </Link>{' '}
          with the new password.
        </Alert>
      )}
      {token && !confirm.isSuccess && (
        <ChoosePasswordForm
          submitLabel="Save the new password"
          pending={confirm.isPending}
          error={confirm.error}
          onSubmit={(password) => confirm.mutate({ token, password })}
        />
      )}
      <p className="mt-6 text-center text-sm">
        <Link to={paths.signIn} className="text-copper-700 hover:underline">
          Back to sign-in
        </Link>
      </p>
    </AuthFrame>
  );
}
