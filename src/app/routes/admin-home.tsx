// The admin's overview: how many of each thing, and the way to each screen.
import { Link } from 'react-router';
import type { ReactNode } from 'react';
import { PageFrame } from '../../components/page-frame.tsx';
import { useSignedInUser } from '../../lib/auth.ts';
import { useUsers } from '../../features/admin/api/get-users.ts';
import { useFarms } from '../../lib/api/get-farms.ts';
import { usePests } from '../../lib/api/get-pests.ts';
import { useFields } from '../../lib/api/get-fields.ts';

function Tile({ to, label, count, detail }: { to: string; label: string; count: { isPending: boolean; isError: boolean; value?: number }; detail: ReactNode }) {
  return (
    <Link
      to={to}
      className="block rounded-lg bg-white p-4 shadow-sm ring-1 ring-soil-300/60 hover:ring-field-500 focus-visible:outline focus-visible:outline-2 focus-visible:outline-field-600"
    >
      <span className="block text-sm font-medium text-soil-600">{label}</span>
      <span className="mt-1 block text-3xl font-semibold text-field-800">{count.isPending ? '…' : count.isError ? '—' : count.value}</span>
      <span className="mt-1 block text-sm text-soil-700">{detail}</span>
    </Link>
  );
}

export function AdminHome() {
  const user = useSignedInUser();
  const users = useUsers();
  const farms = useFarms();
  const fields = useFields();
  const pests = usePests(true);
  const invited = users.data?.filter((u) => u.invited && u.active).length ?? 0;
  return (
    <PageFrame title="Overview" eyebrow={`Signed in as ${user.name}`}>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <Tile
          to="/admin/users"
          label="Users"
          count={{ ...users, value: users.data?.length }}
          detail={invited ? `${invited} invitation${invited === 1 ? '' : 's'} not yet accepted` : 'Invite, change roles, deactivate'}
        />
        <Tile to="/admin/farms" label="Farms" count={{ ...farms, value: farms.data?.length }} detail="Grower contacts and linked accounts" />
        <Tile to="/admin/farms" label="Fields" count={{ ...fields, value: fields.data?.length }} detail="Boundaries, crops, seasons, scouts" />
        <Tile
          to="/admin/pests"
          label="Pest library"
          count={{ ...pests, value: pests.data?.filter((p) => p.active).length }}
          detail="Active pests with their thresholds"
        />
      </div>
      <p className="text-sm text-soil-700">
        Mail that Patchwise sends is kept in the{' '}
        <Link to="/admin/mailbox" className="font-medium text-field-700 underline">
          mailbox
        </Link>{' '}
        while no real mail server is configured. Dates in the app and in e-mails follow your organisation’s{' '}
        <Link to="/admin/dates" className="font-medium text-field-700 underline">
          dates and times
        </Link>
        .
      </p>
    </PageFrame>
  );
}
