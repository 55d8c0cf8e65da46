// Route guards read the one "me" query; the server still checks every call on its own.
import type { ReactNode } from 'react';
import { Navigate, Outlet, useLocation } from 'react-router';
import type { Role } from '@shared/schemas/roles.ts';
import { useMe } from '../lib/auth.ts';
import { ErrorState, LoadingState } from '../components/query-states.tsx';
import { PageFrame } from '../components/page-frame.tsx';

function FullPageLoading() {
  return (
    <div className="flex min-h-screen items-center justify-center">
      <LoadingState label="Opening Patchwise…" />
    </div>
  );
}

export function RequireSignedIn({ children }: { children: ReactNode }) {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) return <FullPageLoading />;
  if (me.isError)
    return (
      <div className="mx-auto max-w-md p-6">
        <ErrorState error={me.error} onRetry={() => me.refetch()} />
      </div>
    );
  if (!me.data.user) return <Navigate to="/sign-in" replace state={{ from: location.pathname + location.search }} />;
  return children;
}

/** Sign-in and forgotten-password pages: a signed-in person goes straight home. */
export function SignedOutOnly() {
  const me = useMe();
  if (me.isPending) return <FullPageLoading />;
  if (me.data?.user) return <Navigate to="/" replace />;
  return <Outlet />;
}

export function RequireRole({ roles, children }: { roles: readonly Role[]; children: ReactNode }) {
  const { data } = useMe();
  if (!data?.user || !roles.includes(data.user.role)) {
    return (
      <PageFrame title="Not available to your role">
        <p className="text-soil-700">This page is for {roles.join(', ')} accounts. Ask an admin if you need it.</p>
      </PageFrame>
    );
  }
  return children;
}
