/**
 * Sign-in, sessions and password reset (better-auth), configured for OWASP ASVS Level 2:
 * argon2id hashing, passwords of 12 to 128 characters, an absolute session lifetime of 12 hours,
 * sign-in attempts throttled per address (better-auth) and per account (ours), sessions revoked
 * on password reset, no public sign-up (admins create accounts).
 */
import { betterAuth } from 'better-auth';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import { APIError, createAuthMiddleware } from 'better-auth/api';
import { admin } from 'better-auth/plugins';
import { createAccessControl } from 'better-auth/plugins/access';
import { ROLES } from '../lib/domain';
import { getDb, schema, type Db } from '../db/client';
import { logActivity } from './activity';
import { sendMail } from './mail';
import { hashPassword, MAX_PASSWORD_LENGTH, MIN_PASSWORD_LENGTH, verifyPassword } from './passwords';
import { accountThrottle } from './throttle';
import { appBaseUrl, trustedOrigins } from './config';

/** ASVS 4.0.3 3.3.2 (L2): re-authenticate at least every 12 hours. */
export const SESSION_ABSOLUTE_SECONDS = 12 * 60 * 60;

// User management permissions of the admin plugin; only `admin` holds them. Product permissions
// live in src/server/authz.ts.
const ac = createAccessControl({
  user: ['create', 'list', 'set-role', 'ban', 'impersonate', 'delete', 'set-password', 'get', 'update'],
  session: ['list', 'revoke', 'delete'],
} as const);
const roles = Object.fromEntries(
  ROLES.map((r) => [
    r,
    r === 'admin'
      ? ac.newRole({
          user: ['create', 'list', 'set-role', 'ban', 'delete', 'set-password', 'get', 'update'],
          session: ['list', 'revoke', 'delete'],
        })
      : ac.newRole({ user: [], session: [] }),
  ]),
);

function build(db: Db) {
  return betterAuth({
    appName: 'Plumbline',
    // Failed sign-ins are recorded in the activity log; better-auth's own warnings would only repeat them.
    logger: { level: 'error' },
    baseURL: appBaseUrl(),
    secret: process.env.BETTER_AUTH_SECRET,
    trustedOrigins: trustedOrigins(),
    database: drizzleAdapter(db, { provider: 'pg', schema }),
    emailAndPassword: {
      enabled: true,
      disableSignUp: true,
      minPasswordLength: MIN_PASSWORD_LENGTH,
      maxPasswordLength: MAX_PASSWORD_LENGTH,
      password: { hash: hashPassword, verify: verifyPassword },
      resetPasswordTokenExpiresIn: 60 * 60,
      revokeSessionsOnPasswordReset: true,
      sendResetPassword: async ({ user, url }) => {
        // A new account gets the same link, worded as a welcome (its callback carries welcome=1).
        const welcome = decodeURIComponent(url).includes('welcome=1');
        await sendMail(
          welcome
            ? {
                to: user.email,
                subject: 'Your Plumbline account: choose a password',
                text:
                  `Hello ${user.name},\n\nAn administrator created a Plumbline account for you (${user.email}). ` +
                  `Open this link within one hour to choose your password:\n\n${url}\n\n` +
                  'If the link has expired, use "Forgot your password?" on the sign-in page.\n',
              }
            : {
                to: user.email,
                subject: 'Reset your Plumbline password',
                text:
                  `Hello ${user.name},\n\nSomeone (we hope you) asked to reset the password of your Plumbline ` +
                  `account. Open this link within one hour to choose a new password:\n\n${url}\n\n` +
                  'If you did not ask for this, ignore this message: your password stays as it is.\n',
              },
        );
        await logActivity({ action: 'auth.password-reset-requested', userId: user.id, actor: user.email });
      },
      onPasswordReset: async ({ user }) => {
        await logActivity({ action: 'auth.password-reset', userId: user.id, actor: user.email });
      },
    },
    session: {
      expiresIn: SESSION_ABSOLUTE_SECONDS,
      // Never slide the expiry: the lifetime is absolute.
      disableSessionRefresh: true,
    },
    rateLimit: {
      enabled: true,
      storage: 'database',
      window: 60,
      max: 300,
      customRules: {
        // Per client address; PLUMBLINE_SIGNIN_RATE (attempts per minute) lets a test rig raise it.
        '/sign-in/email': { window: 60, max: Number(process.env.PLUMBLINE_SIGNIN_RATE ?? 20) },
        '/request-password-reset': { window: 300, max: 5 },
        '/reset-password': { window: 300, max: 10 },
      },
    },
    advanced: {
      ipAddress: { ipAddressHeaders: ['x-plumbline-client-ip'] },
      useSecureCookies: appBaseUrl().startsWith('https:'),
    },
    plugins: [admin({ ac, roles, defaultRole: 'auditor', adminRoles: ['admin'] })],
    hooks: {
      before: createAuthMiddleware(async (ctx) => {
        if (ctx.path !== '/sign-in/email') return;
        const email = String((ctx.body as { email?: unknown } | undefined)?.email ?? '');
        const blocked = await accountThrottle.check(email);
        if (blocked) {
          await logActivity({ action: 'auth.sign-in-throttled', actor: email, ip: ctx.request?.headers.get('x-plumbline-client-ip') ?? '' });
          throw new APIError('TOO_MANY_REQUESTS', {
            message: `Too many failed sign-ins for this account. Try again after ${blocked.toISOString().slice(11, 16)} UTC, or reset your password.`,
          });
        }
      }),
      after: createAuthMiddleware(async (ctx) => {
        if (ctx.path !== '/sign-in/email') return;
        const email = String((ctx.body as { email?: unknown } | undefined)?.email ?? '');
        const ip = ctx.request?.headers.get('x-plumbline-client-ip') ?? '';
        const newSession = ctx.context.newSession;
        if (newSession) {
          await accountThrottle.reset(email);
          await logActivity({ action: 'auth.sign-in', userId: newSession.user.id, actor: email, ip });
        } else {
          await accountThrottle.fail(email);
          await logActivity({ action: 'auth.sign-in-failed', actor: email, ip });
        }
      }),
    },
  });
}

export type Auth = ReturnType<typeof build>;

let instance: Promise<Auth> | undefined;

/** The better-auth instance over the process's database. */
export function getAuth(): Promise<Auth> {
  instance ??= getDb().then(build);
  return instance;
}
