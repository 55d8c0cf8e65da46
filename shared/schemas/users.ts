import { z } from 'zod';
import { oneLineNameSchema } from './one-line-name.ts';
import { emailSchema } from './auth.ts';
import { roleSchema } from './roles.ts';

export const personNameSchema = oneLineNameSchema('Enter a name.', 120, 'Keep the name to 120 characters or fewer.');

export const inviteUserSchema = z.object({
  name: personNameSchema,
  email: emailSchema,
  role: roleSchema,
});

export const updateUserSchema = z
  .object({
    name: personNameSchema.optional(),
    role: roleSchema.optional(),
    active: z.boolean().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { error: 'Change at least one of name, role or active.' });

export const assignmentSchema = z.object({
  userId: z.uuid({ error: 'Choose a user.' }),
});

/** A user as the API answers it; `invited` while no password has been set. */
export const userViewSchema = z.object({
  id: z.uuid(),
  organisationId: z.uuid(),
  name: z.string(),
  email: z.string(),
  role: roleSchema,
  active: z.boolean(),
  invited: z.boolean(),
});
export type UserView = z.infer<typeof userViewSchema>;
export interface UserResponse {
  user: UserView;
}
export interface UserListResponse {
  users: UserView[];
}
