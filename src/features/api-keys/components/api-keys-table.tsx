import { useState } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { ConfirmDialog } from '../../../components/ui/dialog.tsx';
import { EmptyState, ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { Badge, Table } from '../../../components/ui/layout.tsx';
import { useApiKeys, useRevokeApiKey, type ApiKey } from '../api/api-keys.ts';
import { RollKeyDialog } from './roll-key-dialog.tsx';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

export function ApiKeysTable({ canWrite }: { canWrite: boolean }) {
  const [includeRevoked, setIncludeRevoked] = useState(false);
  const keys = useApiKeys(includeRevoked);
  const revoke = useRevokeApiKey();
  const [rolling, setRolling] = useState<ApiKey | null>(null);
  const [revoking, setRevoking] = useState<ApiKey | null>(null);
  const rows = keys.data?.pages.flatMap((page) => page.data) ?? [];

  return (
    <div className="space-y-3">
      <label className="flex items-center gap-2 text-sm text-slag-700">
        <input
          type="checkbox"
          checked={includeRevoked}
          onChange={(e) => setIncludeRevoked(e.target.checked)}
          className="accent-ember-600"
        />
        Show revoked keys
      </label>
      <ProblemAlert error={keys.error ?? revoke.error} />
      {keys.isPending && <Spinner label="Loading keys…" />}
      {!keys.isPending && rows.length === 0 && (
        <EmptyState title="No API keys yet">Issue one for each integration, with only the scopes it needs.</EmptyState>
      )}
      {rows.length > 0 && (
        <Table head={['Name', 'Key', 'Scopes', 'Created by', 'Last used', 'Expires', 'Status', '']} caption="API keys">
          {rows.map((key) => (
            <tr key={key.id}>
              <td className="px-3 py-2 font-medium">{key.name}</td>
              <td className="px-3 py-2 font-mono text-xs">{key.prefix}…</td>
              <td className="px-3 py-2">
                <div className="flex max-w-xs flex-wrap gap-1">
                  {key.scopes.map((s) => (
                    <code key={s} className="rounded bg-ash-100 px-1 text-xs">
                      {s}
                    </code>
                  ))}
                </div>
              </td>
              <td className="px-3 py-2 text-xs">{key.created_by.email}</td>
              <td className="px-3 py-2 font-mono text-xs text-slag-500">
                {key.last_used_at ? <Timestamp value={key.last_used_at} /> : 'never'}
              </td>
              <td className="px-3 py-2 font-mono text-xs text-slag-500">
                <Timestamp value={key.expires_at} />
              </td>
              <td className="px-3 py-2">
                <Badge tone={key.status === 'active' ? 'good' : 'bad'}>{key.status}</Badge>
              </td>
              <td className="whitespace-nowrap px-3 py-2 text-right">
                {canWrite && key.status === 'active' && (
                  <>
                    <Button
                      variant="ghost"
                      onClick={() => setRolling(key)}
                      title="Issue a replacement; you choose how long this key keeps working"
                    >
                      Roll
                    </Button>
                    <Button variant="ghost" className="!text-oxide-600" onClick={() => setRevoking(key)}>
                      Revoke
                    </Button>
                  </>
                )}
              </td>
            </tr>
          ))}
        </Table>
      )}
      {keys.hasNextPage && (
        <Button variant="secondary" onClick={() => keys.fetchNextPage()}>
          Load more
        </Button>
      )}
      <ConfirmDialog
        open={!!revoking}
        title={`Revoke “${revoking?.name}”?`}
        confirmLabel="Revoke now"
        cancelLabel="Keep it"
        busy={revoke.isPending}
        onConfirm={() => revoking && revoke.mutate(revoking.id, { onSuccess: () => setRevoking(null) })}
        onClose={() => setRevoking(null)}
      >
        <p>Calls with this key fail at once with 401. Integrations using it stop working until they get a new key.</p>
      </ConfirmDialog>
      <RollKeyDialog key={rolling?.id ?? 'none'} apiKey={rolling} onClose={() => setRolling(null)} />
    </div>
  );
}
