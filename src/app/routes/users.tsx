import { useState } from 'react';
import { Button } from '../../components/ui/button.tsx';
import { PageHeader } from '../../components/ui/layout.tsx';
import { hasScope, useMe } from '../../api/me.ts';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';
import { InviteUserDialog } from '../../features/users/components/invite-user-dialog.tsx';
import { UsersTable } from '../../features/users/components/users-table.tsx';

export function UsersPage() {
  const { data: me } = useMe();
  const canEdit = hasScope(me, 'users:write');
  const [inviting, setInviting] = useState(false);
  return (
    <RequireScope scope="users:read">
      <PageHeader
        title="Users"
        description="Who can sign in, and with which role. Changing a role or disabling a user ends their sessions at once."
        actions={canEdit && <Button onClick={() => setInviting(true)}>Invite a user</Button>}
      />
      <UsersTable canEdit={canEdit} selfId={me?.user.id} />
      <InviteUserDialog open={inviting} onClose={() => setInviting(false)} />
    </RequireScope>
  );
}
