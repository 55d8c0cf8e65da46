import { csrfSync } from 'csrf-sync';

// Synchroniser token kept in the session; the client sends it back in the x-csrf-token header.
export const { csrfSynchronisedProtection: csrfProtection, generateToken: generateCsrfToken } = csrfSync({
  getTokenFromRequest: (req) => req.headers['x-csrf-token'] as string | undefined,
});
