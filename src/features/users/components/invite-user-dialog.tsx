import { useState, type FormEvent } from 'react';
import { ApiProblem } from '../../../api/problem.ts';
import { Button } from '../../../components/ui/button.tsx';
import { Dialog } from '../../../components/ui/dialog.tsx';
import { Alert, ProblemAlert } from '../../../components/ui/feedback.tsx';
import { SelectField, TextField } from '../../../components/ui/field.tsx';
import { ROLES, useInviteUser, type Role } from '../api/users.ts';

export function InviteUserDialog({ open, onClose }: { open: boolean; onClose: () => void }) {
  const [email, setEmail] = useState('');
  const [name, setName] = useState('');
  const [role, setRole] = useState<Role>('viewer');
  const invite = useInviteUser();
  const problem = invite.error instanceof ApiProblem ? invite.error : undefined;

  function close() {
    invite.reset();
    setEmail('');
    setName('');
    onClose();
  }

  function submit(event: FormEvent) {
    event.preventDefault();
    invite.mutate({ email, name, role });
  }

  return (
    <Dialog open={open} title="Invite a user" onClose={close}>
      {invite.data ? (
        <div className="space-y-4">
          {invite.data.invitation_mail.delivered ? (
            <Alert tone="success" title={`Invitation sent to ${invite.data.user.email}`}>
              The link is valid for 7 days.
            </Alert>
          ) : (
            <Alert title="The user was created, but the e-mail was not sent">
              {invite.data.invitation_mail.error} Send it again from the users table once mail works.
            </Alert>
          )}
          <Button onClick={close}>Done</Button>
        </div>
      ) : (
        <form onSubmit={submit} className="space-y-4" noValidate>
          <ProblemAlert error={invite.error} fields={['email', 'name', 'role']} />
          <TextField
            label="E-mail"
            type="email"
            value={email}
            onChange={(e) => setEmail(e.target.value)}
            error={problem?.fieldError('email')}
          />
          <TextField label="Name" value={name} onChange={(e) => setName(e.target.value)} error={problem?.fieldError('name')} />
          <SelectField label="Role" value={role} onChange={(e) => setRole(e.target.value as Role)} error={problem?.fieldError('role')}>
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {r}
              </option>
            ))}
          </SelectField>
          <div className="flex justify-end gap-2">
            <Button variant="secondary" onClick={close}>
              Cancel
            </Button>
            <Button type="submit" disabled={invite.isPending}>
              Send invitation
            </Button>
          </div>
        </form>
      )}
    </Dialog>
  );
}
