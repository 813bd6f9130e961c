import { useState, type ReactNode } from 'react';
import { Button } from './button.tsx';
import { DialogFooter } from './dialog.tsx';
import { Alert } from './feedback.tsx';

/** The only time a secret is on screen: copy it, then it is gone. `warning` says why it cannot be shown again. */
export function SecretOnce({
  secret,
  onDone,
  warning,
  testId = 'api-key-secret',
}: {
  secret: string;
  onDone: () => void;
  warning: ReactNode;
  testId?: string;
}) {
  const [copied, setCopied] = useState(false);
  return (
    <div className="space-y-4">
      <Alert tone="caution" title="Copy the secret now: it will not be shown again">
        {warning}
      </Alert>
      <pre data-testid={testId} className="overflow-x-auto rounded-md bg-slag-900 p-3 text-sm text-ash-100 select-all">
        {secret}
      </pre>
      <DialogFooter spread>
        <Button
          variant="secondary"
          onClick={() => {
            void navigator.clipboard?.writeText(secret).then(() => setCopied(true));
          }}
        >
          {copied ? '✓ Copied' : 'Copy to clipboard'}
        </Button>
        <Button onClick={onDone}>I have stored it</Button>
      </DialogFooter>
    </div>
  );
}
