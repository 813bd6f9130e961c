// Rolling a key: the user chooses how long the old key keeps working, sees until when before
// confirming, then copies the replacement once.
import { useState } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { Dialog, DialogFooter } from '../../../components/ui/dialog.tsx';
import { ProblemAlert } from '../../../components/ui/feedback.tsx';
import { SelectField } from '../../../components/ui/field.tsx';
import { SecretOnce } from '../../../components/ui/secret-once.tsx';
import { localDateTime } from '../../../lib/local-time.ts';
import { useRollApiKey, type ApiKey } from '../api/api-keys.ts';
import { KEY_SECRET_WARNING } from './key-secret-warning.ts';

/** The overlaps offered, within the API's 0–10080 minutes. */
export const OVERLAPS: { minutes: number; label: string }[] = [
  { minutes: 0, label: 'No overlap: the old key stops at once' },
  { minutes: 15, label: '15 minutes' },
  { minutes: 60, label: '1 hour' },
  { minutes: 1440, label: '1 day' },
  { minutes: 10080, label: '7 days (the longest)' },
];

/** When the old key would stop: after the overlap, or at its own expiry when that comes first. */
function stopsAt(key: ApiKey, minutes: number, now: number): string {
  const overlapEnd = new Date(now + minutes * 60_000).toISOString();
  return key.expires_at && key.expires_at < overlapEnd ? key.expires_at : overlapEnd;
}

export function RollKeyDialog({ apiKey, onClose }: { apiKey: ApiKey | null; onClose: () => void }) {
  const [minutes, setMinutes] = useState(60);
  const [now, setNow] = useState(() => Date.now());
  const roll = useRollApiKey();

  function close() {
    roll.reset();
    setMinutes(60);
    onClose();
  }

  if (roll.data) {
    return (
      <Dialog open title="Replacement key issued" onClose={close}>
        <p className="mb-3 text-sm" data-testid="roll-old-key-stops">
          {roll.variables?.overlap_minutes === 0
            ? 'The old key has stopped working.'
            : `The old key keeps working until ${localDateTime(roll.data.previous.expires_at)}. Switch your integration to the new key before then.`}
        </p>
        <SecretOnce secret={roll.data.secret} warning={KEY_SECRET_WARNING} onDone={close} />
      </Dialog>
    );
  }

  const ends = apiKey ? stopsAt(apiKey, minutes, now) : '';
  const capped = !!apiKey?.expires_at && ends === apiKey.expires_at && minutes > 0;
  return (
    <Dialog open={!!apiKey} title={`Roll “${apiKey?.name}”?`} onClose={close}>
      <div className="mb-4 space-y-3 text-sm">
        <p>A new key is issued with the same name, scopes and restrictions. Its secret is shown once.</p>
        <SelectField
          label="The old key keeps working for"
          value={String(minutes)}
          onChange={(event) => {
            setMinutes(Number(event.target.value));
            setNow(Date.now());
          }}
        >
          {OVERLAPS.map((overlap) => (
            <option key={overlap.minutes} value={overlap.minutes}>
              {overlap.label}
            </option>
          ))}
        </SelectField>
        <p className="rounded-md bg-ash-100 p-3" data-testid="roll-overlap">
          {minutes === 0
            ? 'Calls with the old key fail with 401 as soon as you roll it. Integrations using it stop until they get the new key.'
            : `Calls with the old key keep working until ${localDateTime(ends)}${capped ? ' (its own expiry, which comes first)' : ''}, then fail with 401.`}
        </p>
        <ProblemAlert error={roll.error} />
      </div>
      <DialogFooter>
        <Button variant="secondary" onClick={close}>
          Cancel
        </Button>
        <Button
          variant={minutes === 0 ? 'danger' : 'primary'}
          disabled={roll.isPending || !apiKey}
          onClick={() => apiKey && roll.mutate({ id: apiKey.id, overlap_minutes: minutes })}
        >
          Roll key
        </Button>
      </DialogFooter>
    </Dialog>
  );
}
