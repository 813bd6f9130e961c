import { useState, type FormEvent } from 'react';
import { ApiProblem } from '../../../api/problem.ts';
import { Button } from '../../../components/ui/button.tsx';
import { Alert, ProblemAlert } from '../../../components/ui/feedback.tsx';
import { readIsoDateTime, toIsoDateTimeText } from '../../../lib/iso-date.ts';
import { localZoneName } from '../../../lib/local-time.ts';
import { useRecoverDeliveries } from '../api/deliveries.ts';
import { DateTimeField } from '../../../components/ui/date-field.tsx';

const DAY_MS = 24 * 60 * 60 * 1000;

/** "Recover since": put every delivery that failed since a time back in the queue, e.g. after the receiver was down. */
export function RecoverForm({ endpointId }: { endpointId: string }) {
  const [since, setSince] = useState(() => toIsoDateTimeText(new Date(Date.now() - DAY_MS)));
  const recover = useRecoverDeliveries(endpointId);
  const problem = recover.error instanceof ApiProblem ? recover.error : undefined;
  const [localError, setLocalError] = useState<string>();

  function submit(event: FormEvent) {
    event.preventDefault();
    const iso = readIsoDateTime(since)?.toISOString();
    setLocalError(iso ? undefined : 'Write the time as yyyy-mm-dd hh:mm (24-hour), e.g. 2026-12-03 06:00.');
    if (iso) recover.mutate(iso);
  }

  return (
    <form onSubmit={submit} className="flex flex-wrap items-end gap-3" noValidate>
      <div className="w-72">
        <DateTimeField
          label={`Recover failed deliveries since (${localZoneName()})`}
          value={since}
          onChange={(e) => setSince(e.target.value)}
          error={localError ?? problem?.fieldError('since')}
        />
      </div>
      <Button type="submit" variant="secondary" disabled={recover.isPending}>
        Recover
      </Button>
      <div className="basis-full">
        <ProblemAlert error={recover.error} fields={['since']} />
        {recover.data && (
          <Alert
            tone="success"
            title={`${recover.data.requeued} failed ${recover.data.requeued === 1 ? 'delivery' : 'deliveries'} queued again`}
          >
            Each gets one more attempt now; follow them in the table below.
          </Alert>
        )}
      </div>
    </form>
  );
}
