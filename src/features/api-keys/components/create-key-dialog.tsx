import { useState, type FormEvent } from 'react';
import { ApiProblem } from '../../../api/problem.ts';
import { Button } from '../../../components/ui/button.tsx';
import { Dialog, DialogFooter } from '../../../components/ui/dialog.tsx';
import { ProblemAlert } from '../../../components/ui/feedback.tsx';
import { TextField } from '../../../components/ui/field.tsx';
import type { Scope } from '../../../api/me.ts';
import { useCreateApiKey } from '../api/api-keys.ts';
import { SecretOnce } from '../../../components/ui/secret-once.tsx';
import { groupScopes } from '../scope-groups.ts';
import { KEY_SECRET_WARNING } from './key-secret-warning.ts';
import { DateTimeField } from '../../../components/ui/date-field.tsx';
import { readIsoDateTime } from '../../../lib/iso-date.ts';
import { localZoneName } from '../../../lib/local-time.ts';

export function CreateKeyDialog({ open, grantable, onClose }: { open: boolean; grantable: Scope[]; onClose: () => void }) {
  const [name, setName] = useState('');
  const [scopes, setScopes] = useState<Scope[]>([]);
  const [expiresAt, setExpiresAt] = useState('');
  const create = useCreateApiKey();
  const problem = create.error instanceof ApiProblem ? create.error : undefined;

  function close() {
    create.reset();
    setName('');
    setScopes([]);
    setExpiresAt('');
    onClose();
  }

  function toggle(scope: Scope) {
    setScopes((current) => (current.includes(scope) ? current.filter((s) => s !== scope) : [...current, scope]));
  }

  function submit(event: FormEvent) {
    event.preventDefault();
    const expires = readIsoDateTime(expiresAt);
    if (expiresAt.trim() !== '' && !expires) return; // the field says how to write it
    create.mutate({ name, scopes, ...(expires ? { expires_at: expires.toISOString() } : {}) });
  }

  return (
    <Dialog open={open} title={create.data ? `Key “${create.data.name}” issued` : 'Issue an API key'} onClose={close}>
      {create.data ? (
        <SecretOnce secret={create.data.secret} warning={KEY_SECRET_WARNING} onDone={close} />
      ) : (
        <form onSubmit={submit} className="space-y-4" noValidate>
          <ProblemAlert error={create.error} fields={['name', 'scopes', 'expires_at']} />
          <TextField
            label="Name"
            placeholder="e.g. MES melt shop"
            value={name}
            onChange={(e) => setName(e.target.value)}
            error={problem?.fieldError('name')}
          />
          <fieldset>
            <legend className="mb-1 text-sm font-medium text-slag-800">Scopes</legend>
            <p className="mb-2 text-xs text-slag-500">Grant only what the integration does. You can grant the scopes your role holds.</p>
            <div className="max-h-72 space-y-2 overflow-y-auto pr-1">
              {groupScopes(grantable).map((group) => (
                <div key={group.resource} role="group" aria-label={group.label} className="grid grid-cols-[10rem_1fr] items-start gap-2">
                  <span className="pt-0.5 text-xs font-medium text-slag-700">{group.label}</span>
                  <div className="flex flex-wrap gap-x-4 gap-y-1">
                    {group.scopes.map((scope) => (
                      <label key={scope} className="flex items-center gap-2 text-sm">
                        <input
                          type="checkbox"
                          checked={scopes.includes(scope)}
                          onChange={() => toggle(scope)}
                          className="accent-ember-600"
                        />
                        <code className="text-xs">{scope}</code>
                      </label>
                    ))}
                  </div>
                </div>
              ))}
            </div>
            {problem?.fieldError('scopes') && (
              <p role="alert" className="mt-1 text-xs font-medium text-oxide-600">
                ⚠ {problem.fieldError('scopes')}
              </p>
            )}
          </fieldset>
          <DateTimeField
            label="Expires (optional)"
            value={expiresAt}
            onChange={(e) => setExpiresAt(e.target.value)}
            error={problem?.fieldError('expires_at')}
            hint={`yyyy-mm-dd hh:mm, your time (${localZoneName()}). Leave empty for a key that lives until revoked.`}
          />
          <DialogFooter>
            <Button variant="secondary" onClick={close}>
              Cancel
            </Button>
            <Button type="submit" disabled={create.isPending}>
              Issue key
            </Button>
          </DialogFooter>
        </form>
      )}
    </Dialog>
  );
}
