import 'swagger-ui-react/swagger-ui.css';
import SwaggerUI from 'swagger-ui-react';
import { PageHeader } from '../../components/ui/layout.tsx';

/** The OpenAPI reference. "Try it out" calls run with the console's session cookie. */
export function ReferencePage() {
  return (
    <>
      <PageHeader title="API reference" description="Generated from the same schemas that validate requests. “Try it out” calls the API as you, with your role's scopes." />
      <div className="meltwire-reference rounded-lg border border-ash-200 bg-white">
        <SwaggerUI url="/api/v1/openapi.json" deepLinking tryItOutEnabled={false} requestInterceptor={(request) => ({ ...request, credentials: 'same-origin' })} />
      </div>
    </>
  );
}
