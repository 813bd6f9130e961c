import { useState } from 'react';
import { Button } from '../../components/ui/button.tsx';
import { PageHeader } from '../../components/ui/layout.tsx';
import { ApiKeysTable } from '../../features/api-keys/components/api-keys-table.tsx';
import { CreateKeyDialog } from '../../features/api-keys/components/create-key-dialog.tsx';
import { hasScope, useMe } from '../../api/me.ts';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';

export function ApiKeysPage() {
  const { data: me } = useMe();
  const canWrite = hasScope(me, 'api-keys:write');
  const [creating, setCreating] = useState(false);
  return (
    <RequireScope scope="api-keys:read">
      <PageHeader
        title="API keys"
        description="Keys let plant systems and scripts call the API as Authorization: Bearer mw_live_…. Each key carries only the scopes granted to it."
        actions={canWrite && <Button onClick={() => setCreating(true)}>Issue a key</Button>}
      />
      <ApiKeysTable canWrite={canWrite} />
      <CreateKeyDialog open={creating} grantable={me?.scopes ?? []} onClose={() => setCreating(false)} />
    </RequireScope>
  );
}
