// Every signed-in page, with the roles that may open it and its label in the top bar.
// To add a page: append one entry here (lazy-load it if it pulls in the map or charts).
import type { ComponentType } from 'react';
import type { Role } from '@shared/schemas/roles.ts';
import { lazyPage } from './lazy-page.ts';

export interface AppRoute {
  path: string;
  roles: readonly Role[];
  Page: ComponentType;
  /** Shown in the top bar's navigation for these roles when set. */
  nav?: string;
}

const everyone: readonly Role[] = ['admin', 'adviser', 'scout', 'grower'];

// --- Each role's home page, at "/" ---
export const homes: Record<Role, { nav: string; Page: ComponentType }> = {
  admin: { nav: 'Overview', Page: lazyPage(() => import('./routes/admin-home.tsx'), 'AdminHome') },
  adviser: { nav: 'Attention', Page: lazyPage(() => import('../features/advisers/components/adviser-home.tsx'), 'AdviserHome') },
  scout: { nav: 'Walk a field', Page: lazyPage(() => import('../features/walks/components/my-fields-page.tsx'), 'MyFieldsPage') },
  grower: { nav: 'My farms', Page: lazyPage(() => import('../features/grower/components/grower-home.tsx'), 'GrowerHome') },
};

export const appRoutes: AppRoute[] = [
  // --- Any signed-in role (the server decides which fields each one may open) ---
  { path: 'fields/:fieldId', roles: everyone, Page: lazyPage(() => import('../features/fields/components/field-page.tsx'), 'FieldPage') },

  // --- Admin ---
  { path: 'admin/users', roles: ['admin'], nav: 'Users', Page: lazyPage(() => import('../features/admin/components/users-page.tsx'), 'UsersPage') },
  { path: 'admin/farms', roles: ['admin'], nav: 'Farms', Page: lazyPage(() => import('../features/admin/components/farms-page.tsx'), 'FarmsPage') },
  { path: 'admin/farms/:farmId', roles: ['admin'], Page: lazyPage(() => import('./routes/admin-farm-page.tsx'), 'AdminFarmPage') },
  { path: 'admin/farms/:farmId/fields/new', roles: ['admin'], Page: lazyPage(() => import('./routes/new-field-page.tsx'), 'NewFieldPage') },
  { path: 'admin/fields/:fieldId/edit', roles: ['admin'], Page: lazyPage(() => import('./routes/edit-field-page.tsx'), 'EditFieldPage') },
  { path: 'admin/pests', roles: ['admin'], nav: 'Pest library', Page: lazyPage(() => import('../features/admin/components/pests-page.tsx'), 'PestsPage') },
  {
    path: 'admin/dates',
    roles: ['admin'],
    nav: 'Dates and times',
    Page: lazyPage(() => import('../features/admin/components/date-settings-page.tsx'), 'DateSettingsPage'),
  },
  { path: 'admin/mailbox', roles: ['admin'], nav: 'Mailbox', Page: lazyPage(() => import('../features/admin/components/mailbox-page.tsx'), 'MailboxPage') },
  { path: 'admin/mailbox/:messageId', roles: ['admin'], Page: lazyPage(() => import('../features/admin/components/mailbox-page.tsx'), 'MailboxPage') },

  // --- Adviser (admins may open these too) ---
  { path: 'fields', roles: ['adviser'], nav: 'Fields', Page: lazyPage(() => import('../features/fields/components/fields-home.tsx'), 'AdviserFieldsHome') },
  {
    path: 'fields/:fieldId/review',
    roles: ['adviser', 'admin'],
    Page: lazyPage(() => import('../features/checks/components/field-review-page.tsx'), 'FieldReviewPage'),
  },

  // --- Scout ---
  { path: 'scout/fields', roles: ['scout'], Page: lazyPage(() => import('../features/walks/components/my-fields-page.tsx'), 'MyFieldsPage') },
  { path: 'scout/upload', roles: ['scout'], Page: lazyPage(() => import('../features/walks/components/just-upload-page.tsx'), 'JustUploadPage') },
  { path: 'scout/fields/:fieldId', roles: ['scout'], Page: lazyPage(() => import('../features/walks/components/field-walks-page.tsx'), 'FieldWalksPage') },
  { path: 'scout/walks/:walkId', roles: ['scout'], Page: lazyPage(() => import('../features/walks/components/walk-page.tsx'), 'WalkPage') },
  {
    path: 'scout/walks/:walkId/pin/:sightingId',
    roles: ['scout'],
    Page: lazyPage(() => import('../features/walks/components/pin-photo-page.tsx'), 'PinPhotoPage'),
  },

  // --- Treatment zones and zone notices (advisers and admins) ---
  {
    path: 'fields/:fieldId/zones',
    roles: ['admin', 'adviser'],
    Page: lazyPage(() => import('../features/zones/components/zone-editor-page.tsx'), 'ZoneEditorPage'),
  },
  {
    path: 'fields/:fieldId/notices/new',
    roles: ['admin', 'adviser'],
    Page: lazyPage(() => import('../features/notices/components/compose-notice-page.tsx'), 'ComposeNoticePage'),
  },
  {
    path: 'notices',
    roles: ['adviser', 'admin'],
    nav: 'Notices',
    Page: lazyPage(() => import('../features/notices/components/notices-page.tsx'), 'NoticesPage'),
  },
  { path: 'notices/:noticeId', roles: ['admin', 'adviser'], Page: lazyPage(() => import('../features/notices/components/notice-page.tsx'), 'NoticePage') },

  // --- Grower ---
  {
    path: 'grower/notices/:noticeId',
    roles: ['grower'],
    Page: lazyPage(() => import('../features/grower/components/grower-notice-page.tsx'), 'GrowerNoticePage'),
  },
];

export function navFor(role: Role): Array<{ to: string; label: string }> {
  return [{ to: '/', label: homes[role].nav }, ...appRoutes.filter((r) => r.nav && r.roles.includes(role)).map((r) => ({ to: `/${r.path}`, label: r.nav! }))];
}
