import { AuthFrame } from '../../features/auth/components/auth-frame.tsx';
import { SignInForm } from '../../features/auth/components/sign-in-form.tsx';

export function SignInPage() {
  return (
    <AuthFrame title="Sign in to Meltwire">
      <SignInForm />
    </AuthFrame>
  );
}
