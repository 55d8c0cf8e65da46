// The signed-in frame: top bar with the product, the person's role and sign-out; navigation that
// scrolls sideways on a phone instead of hiding behind a menu button.
import { Suspense } from 'react';
import { NavLink, Outlet, useNavigate } from 'react-router';
import { roleLabels } from '@shared/schemas/roles.ts';
import { useSignedInUser } from '../lib/auth.ts';
import { LoadingState } from '../components/query-states.tsx';
import { useSignOut } from '../features/auth/api/sign-out.ts';
import { navFor } from './routes.tsx';
import { OutboxBanner } from '../features/walks/components/outbox-banner.tsx';
import { useOutboxSending } from '../features/walks/outbox/use-outbox.ts';

/** A scout's outbox is sent from whichever page is open, and its state shows on every page. */
function ScoutOutbox() {
  useOutboxSending();
  return <OutboxBanner />;
}

export function AppLayout() {
  const user = useSignedInUser();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const links = navFor(user.role);
  return (
    <div className="flex min-h-screen flex-col">
      <a
        href="#main"
        className="print:hidden sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-[1000] focus:rounded focus:bg-white focus:px-3 focus:py-2"
      >
        Skip to content
      </a>
      <header className="bg-field-800 text-white shadow print:hidden">
        <div className="mx-auto flex max-w-7xl items-center gap-3 px-4 py-2 sm:px-6">
          <NavLink to="/" className="flex items-center gap-2 text-lg font-semibold tracking-tight">
            <span aria-hidden="true" className="inline-block h-5 w-5 rounded bg-field-400 ring-2 ring-patch-400" />
            Patchwise
          </NavLink>
          <div className="ml-auto flex items-center gap-3 text-sm">
            <span className="hidden text-field-100 sm:inline">{user.name}</span>
            <span
              className="rounded-full bg-field-700 px-2 py-0.5 text-xs font-medium uppercase tracking-wide text-straw-100"
              aria-label={`Role: ${roleLabels[user.role]}`}
            >
              {roleLabels[user.role]}
            </span>
            <button
              type="button"
              className="min-h-10 rounded-md px-3 font-medium text-white ring-1 ring-inset ring-field-500 hover:bg-field-700 focus-visible:outline focus-visible:outline-2 focus-visible:outline-straw-200"
              disabled={signOut.isPending}
              onClick={() => signOut.mutate(undefined, { onSettled: () => navigate('/sign-in', { replace: true }) })}
            >
              Sign out
            </button>
          </div>
        </div>
        {links.length > 0 && (
          <nav aria-label="Main" className="mx-auto max-w-7xl overflow-x-auto px-2 sm:px-4">
            <ul className="flex gap-1">
              {links.map((link) => (
                <li key={link.to}>
                  <NavLink
                    to={link.to}
                    end={link.to === '/'}
                    className={({ isActive }) =>
                      `block whitespace-nowrap border-b-4 px-3 py-2.5 text-sm font-medium ${isActive ? 'border-patch-400 text-white' : 'border-transparent text-field-100 hover:text-white'}`
                    }
                  >
                    {link.label}
                  </NavLink>
                </li>
              ))}
            </ul>
          </nav>
        )}
      </header>
      {user.role === 'scout' && <ScoutOutbox />}
      <main id="main" className="flex-1">
        <Suspense
          fallback={
            <div className="mx-auto max-w-5xl px-6">
              <LoadingState />
            </div>
          }
        >
          <Outlet />
        </Suspense>
      </main>
    </div>
  );
}
