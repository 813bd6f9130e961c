import { useQuery } from '@tanstack/react-query';
import { api, unwrap } from '../../api/client.ts';
import { isProblem } from '../../api/problem.ts';
import { Alert, EmptyState, ProblemAlert, Spinner } from '../../components/ui/feedback.tsx';
import { systemKeys } from '../../api/query-keys.ts';
import { Timestamp } from '../../components/ui/timestamp.tsx';

export function OutboxList() {
  const outbox = useQuery({ queryKey: systemKeys.outbox(), queryFn: () => unwrap(api.GET('/dev/outbox')), refetchInterval: 5000 });
  if (outbox.isPending) return <Spinner label="Loading captured e-mail…" />;
  if (isProblem(outbox.error, 404)) {
    return (
      <Alert tone="info" title="No outbox here">
        This server delivers e-mail through the SMTP server in SMTP_URL.
      </Alert>
    );
  }
  if (outbox.error) return <ProblemAlert error={outbox.error} />;
  if (outbox.data.data.length === 0)
    return <EmptyState title="No e-mail captured yet">Invitations and password-reset links appear here.</EmptyState>;
  return (
    <ul className="space-y-3">
      {outbox.data.data.map((mail) => (
        <li key={mail.id} className="rounded-lg border border-ash-200 bg-white p-4">
          <p className="font-medium">{mail.subject}</p>
          <p className="text-xs text-slag-500">
            to {mail.to.join(', ')} · <Timestamp value={mail.received_at} seconds />
          </p>
          <pre className="mt-2 whitespace-pre-wrap font-mono text-xs text-slag-800">{mail.text}</pre>
        </li>
      ))}
    </ul>
  );
}
