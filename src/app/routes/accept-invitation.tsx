import { Link, useSearchParams } from 'react-router';
import { Alert } from '../../components/ui/feedback.tsx';
import { useAcceptInvitation } from '../../features/auth/api/session.ts';
import { AuthFrame } from '../../features/auth/components/auth-frame.tsx';
import { ChoosePasswordForm } from '../../features/auth/components/choose-password-form.tsx';
import { paths } from '../../config/paths.ts';

export function AcceptInvitationPage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const accept = useAcceptInvitation();
  return (
    <AuthFrame title="Accept your invitation">
      {!token && <Alert title="This link has no invitation token">Open the link from your invitation e-mail again.</Alert>}
      {token && accept.isSuccess && (
        <Alert tone="success" title="Your account is active">
          <Link to={paths.signIn} className="text-copper-700 underline">
            Sign in
          </Link>{' '}
          with {accept.data.email}.
        </Alert>
      )}
      {token && !accept.isSuccess && (
        <ChoosePasswordForm
          submitLabel="Activate my account"
          pending={accept.isPending}
          error={accept.error}
          onSubmit={(password) => accept.mutate({ token, password })}
        />
      )}
    </AuthFrame>
  );
}
