import { useSignedInUser } from '../lib/auth.ts';
import { homes } from './routes.tsx';

export function RoleHome() {
  const user = useSignedInUser();
  const { Page } = homes[user.role];
  return <Page />;
}
