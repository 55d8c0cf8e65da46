// Users of the advisory business: invite, change role, deactivate and reactivate, resend an invitation.
import { createColumnHelper } from '@tanstack/react-table';
import { roleLabels, roles, type Role } from '@shared/schemas/roles.ts';
import { PageFrame } from '../../../components/page-frame.tsx';
import { Button } from '../../../components/button.tsx';
import { FormMessage } from '../../../components/form-field.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { TableFrame } from '../../../components/table-frame.tsx';
import { useSignedInUser } from '../../../lib/auth.ts';
import { errorMessage } from '../../../lib/form-errors.ts';
import type { UserView as User } from '@shared/schemas/users.ts';
import { useUsers } from '../api/get-users.ts';
import { useUpdateUser } from '../api/update-user.ts';
import { useResendInvitation } from '../api/resend-invitation.ts';
import { InviteUserForm } from './invite-user-form.tsx';

const column = createColumnHelper<User>();

function StatusBadge({ user }: { user: User }) {
  if (!user.active) return <span className="rounded-full bg-soil-300/40 px-2 py-0.5 text-xs font-medium text-soil-700">Deactivated</span>;
  if (user.invited) return <span className="rounded-full bg-straw-200 px-2 py-0.5 text-xs font-medium text-soil-800">Invited</span>;
  return <span className="rounded-full bg-field-100 px-2 py-0.5 text-xs font-medium text-field-800">Active</span>;
}

export function UsersPage() {
  const me = useSignedInUser();
  const users = useUsers();
  const update = useUpdateUser();
  const resend = useResendInvitation();
  const failure = update.error ?? resend.error;

  const columns = [
    column.accessor('name', { header: 'Name', cell: (info) => <span className="font-medium">{info.getValue()}</span> }),
    column.accessor('email', { header: 'E-mail' }),
    column.accessor('role', {
      header: 'Role',
      cell: (info) => {
        const user = info.row.original;
        if (user.id === me.id) return roleLabels[user.role];
        return (
          <select
            aria-label={`Role of ${user.name}`}
            value={user.role}
            disabled={update.isPending}
            onChange={(e) => update.mutate({ id: user.id, role: e.target.value as Role })}
            className="rounded border-0 bg-transparent py-1 pl-1 pr-7 text-sm ring-1 ring-inset ring-soil-300 focus:ring-2 focus:ring-field-600"
          >
            {roles.map((role) => (
              <option key={role} value={role}>
                {roleLabels[role]}
              </option>
            ))}
          </select>
        );
      },
    }),
    column.accessor((u) => (u.active ? (u.invited ? 'invited' : 'active') : 'deactivated'), {
      id: 'status',
      header: 'Status',
      cell: (info) => <StatusBadge user={info.row.original} />,
    }),
    column.display({
      id: 'actions',
      header: () => <span className="sr-only">Actions</span>,
      cell: (info) => {
        const user = info.row.original;
        if (user.id === me.id) return <span className="text-xs text-soil-600">You</span>;
        return (
          <div className="flex justify-end gap-1">
            {user.invited && user.active && (
              <Button
                variant="quiet"
                size="sm"
                busy={resend.isPending && resend.variables === user.id}
                onClick={() => resend.mutate(user.id)}
                aria-label={`Send the invitation to ${user.name} again`}
              >
                Send invitation again
              </Button>
            )}
            <Button
              variant="quiet"
              size="sm"
              className={user.active ? 'text-patch-700' : ''}
              onClick={() => update.mutate({ id: user.id, active: !user.active })}
              aria-label={`${user.active ? 'Deactivate' : 'Reactivate'} ${user.name}`}
            >
              {user.active ? 'Deactivate' : 'Reactivate'}
            </Button>
          </div>
        );
      },
    }),
  ];

  return (
    <PageFrame title="Users" eyebrow="Admin" wide>
      <InviteUserForm />
      {failure && <FormMessage>{errorMessage(failure)}</FormMessage>}
      {resend.isSuccess && <FormMessage tone="success">A new invitation is on its way to {resend.data.email}.</FormMessage>}
      {users.isPending ? (
        <LoadingState label="Loading users…" />
      ) : users.isError ? (
        <ErrorState error={users.error} onRetry={() => users.refetch()} />
      ) : users.data.length === 0 ? (
        <EmptyState title="No users yet" />
      ) : (
        <TableFrame caption="Users" columns={columns} rows={users.data} rowId={(u) => u.id} />
      )}
    </PageFrame>
  );
}
