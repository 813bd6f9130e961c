import type { QueryClient } from '@tanstack/react-query';
import { createBrowserRouter, redirect } from 'react-router';
import { Spinner } from '../components/ui/feedback.tsx';
import { meQuery } from '../api/me.ts';
import { ConsoleLayout } from './layout.tsx';
import { AcceptInvitationPage } from './routes/accept-invitation.tsx';
import { ApiKeysPage } from './routes/api-keys.tsx';
import { AuditPage } from './routes/audit.tsx';
import { ControlChartPage } from './routes/control-chart.tsx';
import { ControlSamplesPage } from './routes/control-samples.tsx';
import { DriftNewRunPage } from './routes/drift-new.tsx';
import { DriftRunPage } from './routes/drift-run.tsx';
import { EventsPage } from './routes/events.tsx';
import { GradesPage } from './routes/grades.tsx';
import { HomePage } from './routes/home.tsx';
import { ImportPage } from './routes/import.tsx';
import { ImportsPage } from './routes/imports.tsx';
import { MyAlertsPage } from './routes/my-alerts.tsx';
import { NotFoundPage } from './routes/not-found.tsx';
import { OutboxPage } from './routes/outbox.tsx';
import { QuickStartPage } from './routes/quick-start.tsx';
import { RequestLogPage } from './routes/request-log.tsx';
import { ResetPasswordPage } from './routes/reset-password.tsx';
import { RouteError } from './routes/route-error.tsx';
import { SamplePage } from './routes/sample.tsx';
import { SamplesPage } from './routes/samples.tsx';
import { SignInPage } from './routes/sign-in.tsx';
import { UploadPage } from './routes/upload.tsx';
import { UsersPage } from './routes/users.tsx';
import { WebhookEndpointPage } from './routes/webhook-endpoint.tsx';
import { WebhooksPage } from './routes/webhooks.tsx';

export function createRouter(queryClient: QueryClient) {
  /** Loader of the signed-in area: no session → the sign-in page, remembering where to return. */
  async function requireSession({ request }: { request: Request }) {
    const me = await queryClient.ensureQueryData(meQuery);
    if (!me) {
      const url = new URL(request.url);
      throw redirect(`/sign-in?next=${encodeURIComponent(url.pathname + url.search)}`);
    }
    return null;
  }

  return createBrowserRouter([
    {
      HydrateFallback: () => <Spinner />,
      errorElement: <RouteError />,
      children: [
        { path: '/sign-in', element: <SignInPage /> },
        { path: '/accept-invitation', element: <AcceptInvitationPage /> },
        { path: '/reset-password', element: <ResetPasswordPage /> },
        {
          loader: requireSession,
          element: <ConsoleLayout />,
          children: [
            { index: true, element: <HomePage /> },
            { path: 'samples', element: <SamplesPage /> },
            { path: 'samples/:id', element: <SamplePage /> },
            { path: 'imports', element: <ImportsPage /> },
            { path: 'imports/new', element: <UploadPage /> },
            { path: 'imports/:id', element: <ImportPage /> },
            { path: 'quick-start', element: <QuickStartPage /> },
            { path: 'api-keys', element: <ApiKeysPage /> },
            { path: 'reference', lazy: async () => ({ Component: (await import('./routes/reference.tsx')).ReferencePage }) },
            { path: 'request-log', element: <RequestLogPage /> },
            // The chart library is loaded with the Drift page only.
            { path: 'drift', lazy: async () => ({ Component: (await import('./routes/drift.tsx')).DriftPage }) },
            { path: 'drift/new', element: <DriftNewRunPage /> },
            { path: 'drift/runs/:id', element: <DriftRunPage /> },
            { path: 'control-samples', element: <ControlSamplesPage /> },
            { path: 'control-samples/:id', element: <ControlChartPage /> },
            { path: 'grades', element: <GradesPage /> },
            { path: 'users', element: <UsersPage /> },
            { path: 'audit', element: <AuditPage /> },
            { path: 'outbox', element: <OutboxPage /> },
            { path: 'webhooks', element: <WebhooksPage /> },
            { path: 'webhooks/:id', element: <WebhookEndpointPage /> },
            { path: 'events', element: <EventsPage /> },
            { path: 'my-alerts', element: <MyAlertsPage /> },
            { path: '*', element: <NotFoundPage /> },
          ],
        },
      ],
    },
  ]);
}
