// The signed-in pages the client serves, read from its route table (src/app/routes.tsx), so the accessibility
// suites can say which page has no check yet — as tests/api/route-coverage.test.ts does for API routes.
import { appRoutes, homes } from '../../src/app/routes.tsx';
import type { Role } from '../../shared/schemas/roles.ts';

/** Each role's home is its own page at "/", named by the role. */
export const homePage = (role: Role) => `/ (${role} home)`;

/** Every signed-in page: each role's home, then each app route as "/path/:param". */
export function signedInPages(): string[] {
  return [...(Object.keys(homes) as Role[]).map(homePage), ...appRoutes.map((route) => `/${route.path}`)];
}

/** The roles that may open a page, as the route table says. */
export function rolesOf(page: string): readonly Role[] {
  const home = (Object.keys(homes) as Role[]).find((role) => homePage(role) === page);
  if (home) return [home];
  return appRoutes.find((route) => `/${route.path}` === page)?.roles ?? [];
}

/** Pages with no row among `covered`, and rows that name no page the client serves. */
export function coverageGaps(covered: string[]) {
  const pages = signedInPages();
  return {
    missing: pages.filter((page) => !covered.includes(page)),
    stale: covered.filter((page) => !pages.includes(page)),
    twice: covered.filter((page, i) => covered.indexOf(page) !== i),
  };
}
