import 'swagger-ui-react/swagger-ui.css';
import '../../features/reference/swagger-theme.css';
import SwaggerUI from 'swagger-ui-react';
import { Alert } from '../../components/ui/feedback.tsx';
import { PageHeader } from '../../components/ui/layout.tsx';
import { useMe } from '../../api/me.ts';
import { tryItCurlPlugin } from '../../features/reference/try-it-curl.tsx';

/** Sends "Try it out" calls with the console's session cookie (same origin, httpOnly). */
function withSession(request: { credentials?: RequestCredentials; [key: string]: unknown }) {
  return { ...request, credentials: 'same-origin' as const };
}

/** The OpenAPI reference. "Try it out" calls run with the console's session cookie. */
export function ReferencePage() {
  const { data: me } = useMe();
  return (
    <>
      <PageHeader
        title="API reference"
        description="Generated from the same schemas that validate requests. Each operation names the scope it needs."
      />
      <div className="mb-4">
        <Alert tone="info" title={`“Try it out” calls the API as ${me?.user.email ?? 'you'}`}>
          Calls made here carry your session, so your role&apos;s scopes apply ({me?.scopes.length ?? 0} scopes) and they appear in the
          Request log. Integrations use an API key instead: the curl command shown after each call sends{' '}
          <code>Authorization: Bearer $MELTWIRE_KEY</code>, so set <code>MELTWIRE_KEY</code> to your key before you paste it.
        </Alert>
      </div>
      <div className="meltwire-reference rounded-lg border border-ash-200 bg-white px-4" data-testid="api-reference">
        <SwaggerUI
          url="/api/v1/openapi.json"
          deepLinking
          tryItOutEnabled={false}
          requestInterceptor={withSession}
          plugins={[tryItCurlPlugin]}
        />
      </div>
    </>
  );
}
