import { useState } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { Alert } from '../../../components/ui/feedback.tsx';

/** The only time a key's secret is on screen: copy it, then it is gone. */
export function SecretOnce({ secret, onDone }: { secret: string; onDone: () => void }) {
  const [copied, setCopied] = useState(false);
  return (
    <div className="space-y-4">
      <Alert tone="caution" title="Copy the key now">
        Meltwire stores only a hash of it. Once you close this dialog, nobody can show it again — not even an admin.
      </Alert>
      <pre data-testid="api-key-secret" className="overflow-x-auto rounded-md bg-slag-900 p-3 text-sm text-ash-100 select-all">
        {secret}
      </pre>
      <div className="flex justify-between gap-2">
        <Button
          variant="secondary"
          onClick={() => {
            void navigator.clipboard?.writeText(secret).then(() => setCopied(true));
          }}
        >
          {copied ? '✓ Copied' : 'Copy to clipboard'}
        </Button>
        <Button onClick={onDone}>I have stored it</Button>
      </div>
    </div>
  );
}
