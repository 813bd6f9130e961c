import type { ReactNode } from 'react';
import { Alert } from '../../../components/ui/feedback.tsx';
import { hasScope, useMe, type Scope } from '../../../api/me.ts';

/** Renders its children only for callers holding the scope; others see why not. */
export function RequireScope({ scope, children }: { scope: Scope; children: ReactNode }) {
  const { data: me } = useMe();
  if (!hasScope(me, scope)) {
    return (
      <Alert title="Not available for your role">
        This page needs the scope <code>{scope}</code>; your role <code>{me?.user.role}</code> does not hold it. Ask a lab admin if you need
        it.
      </Alert>
    );
  }
  return <>{children}</>;
}
