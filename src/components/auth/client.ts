import { createAuthClient } from 'better-auth/react';

/** better-auth's browser client (same origin). */
export const authClient = createAuthClient();
