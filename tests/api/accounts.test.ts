/** Sign-in and landing per role, password reset by mail through the local SMTP server, admin screens. */
import { describe, expect, it } from 'vitest';
import { baseUrl, call, DEMO, freshAccount, signIn } from '../support/http';

const LANDING: Record<keyof typeof DEMO, string> = {
  admin: '/',
  manager: '/',
  staff: '/installations',
  analyst: '/baselines',
  auditor: '/walkthroughs',
  custodian: '/kits',
};

describe('sign-in', () => {
  it.each(Object.keys(DEMO) as (keyof typeof DEMO)[])('%s signs in and lands on the page of the role', async (role) => {
    const cookie = await signIn(DEMO[role]);
    const start = await fetch(`${baseUrl()}/start`, { headers: { cookie }, redirect: 'manual' });
    expect(start.status).toBe(303);
    expect(new URL(start.headers.get('location')!, baseUrl()).pathname).toBe(LANDING[role]);
    const page = await fetch(`${baseUrl()}${LANDING[role]}`, { headers: { cookie } });
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('Sign out');
  });

  it('pages redirect to sign-in without a session; the API answers 401', async () => {
    const page = await fetch(`${baseUrl()}/buildings`, { redirect: 'manual' });
    expect(page.status).toBe(303);
    expect(page.headers.get('location')).toBe('/sign-in?next=%2Fbuildings');
    const api = await call(null, 'GET', '/api/installations');
    expect(api.status).toBe(401);
  });

  it('a wrong password gets 401 and no cookie', async () => {
    const r = await fetch(`${baseUrl()}/api/auth/sign-in/email`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: baseUrl() },
      body: JSON.stringify({ email: DEMO.analyst, password: 'not-the-password' }),
    });
    expect(r.status).toBe(401);
    expect(r.headers.getSetCookie().some((c) => c.startsWith('better-auth.session_token=') && !c.includes('Max-Age=0'))).toBe(false);
  });

  it('the session cookie is HttpOnly and lives at most 12 hours', async () => {
    const r = await fetch(`${baseUrl()}/api/auth/sign-in/email`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: baseUrl() },
      body: JSON.stringify({ email: DEMO.custodian, password: 'plumbline-demo-2026' }),
    });
    const c = r.headers.getSetCookie().find((x) => x.startsWith('better-auth.session_token='))!;
    expect(c).toMatch(/HttpOnly/i);
    const maxAge = Number(/Max-Age=(\d+)/.exec(c)![1]);
    expect(maxAge).toBeLessThanOrEqual(12 * 3600);
  });

  it('a cross-site request that changes something is refused, whatever its content type', async () => {
    const cookie = await signIn(DEMO.staff);
    for (const [type, body] of [
      ['application/json', JSON.stringify({ notes: 'x' })],
      ['application/x-www-form-urlencoded', 'notes=x'],
      ['multipart/form-data; boundary=x', '--x--'],
    ] as const) {
      const r = await fetch(`${baseUrl()}/api/imports`, { method: 'POST', headers: { cookie, origin: 'https://evil.example', 'content-type': type }, body });
      expect(r.status).toBe(403);
      expect((await r.json()).error.message).toMatch(/Cross-site/);
    }
  });

  it('pages send the security headers', async () => {
    const r = await fetch(`${baseUrl()}/sign-in`);
    expect(r.headers.get('content-security-policy')).toMatch(/frame-ancestors 'none'/);
    expect(r.headers.get('x-content-type-options')).toBe('nosniff');
    expect(r.headers.get('referrer-policy')).toBe('same-origin');
  });
});

describe('password reset', () => {
  it('mails a link through the local SMTP server; the link sets a new password', async () => {
    // A fresh account so other tests keep their passwords.
    const email = `reset.${Date.now()}@example.test`;
    const created = await call('admin', 'POST', '/api/users', { email, name: 'Reset Tester', role: 'analyst' });
    expect(created.status).toBe(201);
    const ask = await fetch(`${baseUrl()}/api/auth/request-password-reset`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: baseUrl() },
      body: JSON.stringify({ email, redirectTo: `${baseUrl()}/reset-password` }),
    });
    expect(ask.status).toBe(200);
    // The outbox holds the message, received by the SMTP server (a real round trip).
    let mail: { to: string; subject: string; text: string; receivedAt: string | null } | undefined;
    for (let i = 0; i < 40 && !mail?.receivedAt; i++) {
      const box = await call('admin', 'GET', '/api/outbox');
      mail = box.body.items.find((m: { to: string; subject: string }) => m.to === email && /Reset your Plumbline password/.test(m.subject));
      if (!mail?.receivedAt) await new Promise((r) => setTimeout(r, 250));
    }
    expect(mail?.receivedAt).toBeTruthy();
    const link = /(http:\/\/\S+\/api\/auth\/reset-password\/\S+)/.exec(mail!.text)![1]!;
    const follow = await fetch(link, { redirect: 'manual' });
    expect(follow.status).toBe(302);
    const to = new URL(follow.headers.get('location')!, baseUrl());
    expect(to.pathname).toBe('/reset-password');
    const token = to.searchParams.get('token')!;
    const short = await fetch(`${baseUrl()}/api/auth/reset-password`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: baseUrl() },
      body: JSON.stringify({ token, newPassword: 'too-short' }),
    });
    expect(short.status).toBe(400);
    const set = await fetch(`${baseUrl()}/api/auth/reset-password`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: baseUrl() },
      body: JSON.stringify({ token, newPassword: 'a brand new passphrase' }),
    });
    expect(set.status).toBe(200);
    const cookie = await signIn(email, 'a brand new passphrase');
    expect(cookie).toMatch(/better-auth.session_token=/);
  });
});

describe('administration', () => {
  it('a role change is logged and takes effect at once', async () => {
    const email = `role.${Date.now()}@example.test`;
    const created = await call('admin', 'POST', '/api/users', { email, name: 'Role Changer', role: 'installation_staff', installations: ['DMF'] });
    expect(created.status).toBe(201);
    const patched = await call('admin', 'PATCH', `/api/users/${created.body.id}`, { role: 'auditor', installations: ['FHS'] });
    expect(patched.status).toBe(200);
    expect(patched.body).toMatchObject({ role: 'auditor', installations: ['FHS'] });
    const log = await call('admin', 'GET', '/api/activity?action=user.role-change');
    expect(log.body.items.some((e: { details: { email: string; to: string } }) => e.details.email === email && e.details.to === 'auditor')).toBe(true);
  });

  it('unknown installations in an assignment are refused by name', async () => {
    const r = await call('admin', 'POST', '/api/users', { email: `x.${Date.now()}@example.test`, name: 'Nobody Here', role: 'auditor', installations: ['NOPE'] });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/NOPE/);
  });
});

describe('sessions end at once', () => {
  // Reads may be served from a short in-process memory of verified sessions (src/server/session-cache.ts);
  // these check that every way of ending a session still ends it for the very next read.
  const me = (cookie: string) => fetch(`${baseUrl()}/api/me`, { headers: { cookie } }).then((r) => r.status);

  it('blocking an account ends its session, reads included', async () => {
    const account = await freshAccount('analyst');
    expect(await me(account.cookie)).toBe(200);
    expect(await me(account.cookie)).toBe(200);
    const blocked = await call('admin', 'PATCH', `/api/users/${account.id}`, { banned: true });
    expect(blocked.status).toBe(200);
    expect(await me(account.cookie)).toBe(401);
  });

  it('a new installation assignment ends the session, so the new scope applies to the next read', async () => {
    const account = await freshAccount('installation_staff', ['DMF']);
    const before = await fetch(`${baseUrl()}/api/installations`, { headers: { cookie: account.cookie } }).then((r) => r.json());
    expect(before.items.map((i: { code: string }) => i.code)).toEqual(['DMF']);
    expect((await call('admin', 'PATCH', `/api/users/${account.id}`, { installations: ['FHS'] })).status).toBe(200);
    expect(await me(account.cookie)).toBe(401);
  });

  it('signing out ends the session, reads included', async () => {
    const account = await freshAccount('auditor', ['KSL']);
    expect(await me(account.cookie)).toBe(200);
    expect(await me(account.cookie)).toBe(200);
    const out = await fetch(`${baseUrl()}/api/auth/sign-out`, { method: 'POST', headers: { cookie: account.cookie, origin: baseUrl(), 'content-type': 'application/json' }, body: '{}' });
    expect(out.status).toBe(200);
    expect(await me(account.cookie)).toBe(401);
  });
});
