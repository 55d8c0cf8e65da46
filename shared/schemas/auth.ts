import { z } from 'zod';

export const emailSchema = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: 'Enter a valid e-mail address, like name@example.com.' }));

// Length over complexity rules (common practice, after NIST SP 800-63B).
export const newPasswordSchema = z
  .string({ error: 'Enter a password.' })
  .min(12, { error: 'Use at least 12 characters for the password.' })
  .max(200, { error: 'Use at most 200 characters for the password.' });

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Enter your password.' }).min(1, { error: 'Enter your password.' }).max(200),
});

export const forgotPasswordSchema = z.object({ email: emailSchema });

export const setPasswordSchema = z.object({
  token: z.string().min(20, { error: 'This link is incomplete: open the link from the e-mail again.' }).max(200),
  password: newPasswordSchema,
});
