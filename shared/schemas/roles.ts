import { z } from 'zod';

export const roles = ['admin', 'adviser', 'scout', 'grower'] as const;
export const roleSchema = z.enum(roles, { error: 'Choose a role: admin, adviser, scout or grower.' });
export type Role = z.infer<typeof roleSchema>;

export const roleLabels: Record<Role, string> = {
  admin: 'Admin',
  adviser: 'Adviser',
  scout: 'Scout',
  grower: 'Grower',
};
