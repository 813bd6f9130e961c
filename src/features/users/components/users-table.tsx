import { Button } from '../../../components/ui/button.tsx';
import { EmptyState, ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { Badge, Table } from '../../../components/ui/layout.tsx';
import { ROLES, useResendInvitation, useUpdateUser, useUsers, type Role, type User } from '../api/users.ts';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

function StatusBadge({ status }: { status: User['status'] }) {
  const tone = status === 'active' ? 'good' : status === 'disabled' ? 'bad' : 'accent';
  return <Badge tone={tone}>{status}</Badge>;
}

export function UsersTable({ canEdit, selfId }: { canEdit: boolean; selfId?: string }) {
  const users = useUsers();
  const update = useUpdateUser();
  const resend = useResendInvitation();
  const rows = users.data?.pages.flatMap((page) => page.data) ?? [];

  if (users.isPending) return <Spinner label="Loading users…" />;
  if (users.error) return <ProblemAlert error={users.error} />;
  if (rows.length === 0) return <EmptyState title="No users yet">Invite the first one.</EmptyState>;

  return (
    <div className="space-y-3">
      <ProblemAlert error={update.error ?? resend.error} />
      <Table head={['Name', 'E-mail', 'Role', 'Status', 'Last sign-in', '']} caption="Users">
        {rows.map((user) => (
          <tr key={user.id}>
            <td className="px-3 py-2 font-medium">{user.name}</td>
            <td className="px-3 py-2">{user.email}</td>
            <td className="px-3 py-2">
              {canEdit && user.id !== selfId ? (
                <select
                  aria-label={`Role of ${user.email}`}
                  className="rounded border border-ash-200 bg-white px-2 py-1 text-sm"
                  value={user.role}
                  disabled={update.isPending}
                  onChange={(e) => update.mutate({ id: user.id, role: e.target.value as Role })}
                >
                  {ROLES.map((r) => (
                    <option key={r}>{r}</option>
                  ))}
                </select>
              ) : (
                <span className="font-mono text-xs">{user.role}</span>
              )}
            </td>
            <td className="px-3 py-2">
              <StatusBadge status={user.status} />
            </td>
            <td className="px-3 py-2 font-mono text-xs text-slag-500">
              <Timestamp value={user.last_login_at} />
            </td>
            <td className="px-3 py-2 text-right">
              {canEdit && user.status === 'invited' && (
                <Button variant="ghost" onClick={() => resend.mutate(user.id)} disabled={resend.isPending}>
                  Resend invitation
                </Button>
              )}
              {canEdit && user.status !== 'invited' && user.id !== selfId && (
                <Button
                  variant="ghost"
                  onClick={() => update.mutate({ id: user.id, status: user.status === 'active' ? 'disabled' : 'active' })}
                  disabled={update.isPending}
                >
                  {user.status === 'active' ? 'Disable' : 'Enable'}
                </Button>
              )}
            </td>
          </tr>
        ))}
      </Table>
      {users.hasNextPage && (
        <Button variant="secondary" onClick={() => users.fetchNextPage()} disabled={users.isFetchingNextPage}>
          Load more
        </Button>
      )}
    </div>
  );
}
