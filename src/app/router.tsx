import { Suspense } from 'react';
import { createBrowserRouter, RouterProvider } from 'react-router';
import { RequireRole, RequireSignedIn, SignedOutOnly } from './guards.tsx';
import { AppLayout } from './layout.tsx';
import { appRoutes } from './routes.tsx';
import { RoleHome } from './role-home.tsx';
import { NotFound, RouteError } from './route-error.tsx';
import { SignInPage } from '../features/auth/components/sign-in-page.tsx';
import { ForgotPasswordPage } from '../features/auth/components/forgot-password-page.tsx';
import { SetPasswordPage } from '../features/auth/components/set-password-page.tsx';
import { LoadingState } from '../components/query-states.tsx';
import { lazyPage } from './lazy-page.ts';

const PublicNoticePage = lazyPage(() => import('../features/notices/components/public-notice-page.tsx'), 'PublicNoticePage');

const router = createBrowserRouter([
  {
    errorElement: <RouteError />,
    children: [
      {
        element: <SignedOutOnly />,
        children: [
          { path: 'sign-in', element: <SignInPage /> },
          { path: 'forgot-password', element: <ForgotPasswordPage /> },
        ],
      },
      // Open whether or not someone is signed in: the link in the e-mail carries its own proof.
      { path: 'set-password', element: <SetPasswordPage /> },
      // The grower's notice page: the token in the link is the only credential, signed in or not.
      {
        path: 'n/:token',
        element: (
          <Suspense
            fallback={
              <div className="mx-auto max-w-3xl px-6">
                <LoadingState label="Opening your notice…" />
              </div>
            }
          >
            <PublicNoticePage />
          </Suspense>
        ),
      },
      {
        element: (
          <RequireSignedIn>
            <AppLayout />
          </RequireSignedIn>
        ),
        children: [
          { index: true, element: <RoleHome /> },
          ...appRoutes.map(({ path, roles, Page }) => ({
            path,
            element: (
              <RequireRole roles={roles}>
                <Page />
              </RequireRole>
            ),
          })),
          { path: '*', element: <NotFound /> },
        ],
      },
    ],
  },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
