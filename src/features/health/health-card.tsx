import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, unwrap } from '../../api/client.ts';
import { Badge, Card } from '../../components/ui/layout.tsx';
import { ProblemAlert, Spinner } from '../../components/ui/feedback.tsx';
import { systemKeys } from '../../api/query-keys.ts';

const healthQuery = queryOptions({
  queryKey: systemKeys.health(),
  queryFn: () => unwrap(api.GET('/health')),
  refetchInterval: 30_000,
});

export function HealthCard() {
  const health = useQuery(healthQuery);
  return (
    <Card title="Server">
      {health.isPending && <Spinner label="Asking the server…" />}
      <ProblemAlert error={health.error} />
      {health.data && (
        <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-2 text-sm">
          <dt className="text-slag-500">Status</dt>
          <dd>
            <Badge tone={health.data.status === 'ok' ? 'good' : 'bad'}>{health.data.status === 'ok' ? '✓ ok' : '⚠ degraded'}</Badge>
          </dd>
          <dt className="text-slag-500">Version</dt>
          <dd className="font-mono" data-testid="server-version">
            {health.data.version}
          </dd>
          <dt className="text-slag-500">Database</dt>
          <dd>
            <span className="font-mono">{health.data.database.client}</span> — {health.data.database.ok ? 'answering' : 'not answering'}
          </dd>
          <dt className="text-slag-500">Server time</dt>
          <dd className="font-mono">{health.data.time}</dd>
        </dl>
      )}
    </Card>
  );
}
