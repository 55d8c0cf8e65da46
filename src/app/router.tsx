import { createBrowserRouter, RouterProvider } from 'react-router';
import { RequireRole, RequireSignedIn, SignedOutOnly } from './guards.tsx';
import { AppLayout } from './layout.tsx';
import { appRoutes } from './routes.tsx';
import { RoleHome } from './role-home.tsx';
import { NotFound, RouteError } from './route-error.tsx';
import { SignInPage } from '../features/auth/components/sign-in-page.tsx';
import { ForgotPasswordPage } from '../features/auth/components/forgot-password-page.tsx';
import { SetPasswordPage } from '../features/auth/components/set-password-page.tsx';

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
