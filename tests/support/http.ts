/** HTTP helpers for API tests: sign in as a demo account and call the API with its cookie. */
import { inject } from 'vitest';

export const DEMO_PASSWORD = 'plumbline-demo-2026';
export const DEMO = {
  admin: 'admin@demo.plumbline.test',
  manager: 'manager@demo.plumbline.test',
  staff: 'staff@demo.plumbline.test', // installation staff of BNP only
  analyst: 'analyst@demo.plumbline.test',
  auditor: 'auditor@demo.plumbline.test', // BNP and KSL
  custodian: 'custodian@demo.plumbline.test',
} as const;
export type DemoRole = keyof typeof DEMO;

export function baseUrl(): string {
  return inject('baseUrl');
}

const cookies = new Map<string, string>();

/** Signs in (once per file and account) and returns the session cookie. */
export async function signIn(email: string, password = DEMO_PASSWORD): Promise<string> {
  const cached = cookies.get(email + password);
  if (cached) return cached;
  const res = await fetch(`${baseUrl()}/api/auth/sign-in/email`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: baseUrl() },
    body: JSON.stringify({ email, password }),
  });
  if (!res.ok) throw new Error(`sign-in ${email} failed: ${res.status} ${await res.text()}`);
  const cookie = res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
  cookies.set(email + password, cookie);
  return cookie;
}

export interface CallResult<T = any> {
  status: number;
  body: T;
  headers: Headers;
}

/** Calls the API; `as` is a demo role, an e-mail, or null for no session. */
export async function call<T = any>(
  as: DemoRole | string | null,
  method: string,
  path: string,
  body?: unknown,
  init: { contentType?: string; raw?: BodyInit } = {},
): Promise<CallResult<T>> {
  const headers: Record<string, string> = { origin: baseUrl() };
  if (as) headers.cookie = await signIn(as in DEMO ? DEMO[as as DemoRole] : as);
  let payload: BodyInit | undefined = init.raw;
  if (body instanceof FormData) payload = body;
  else if (body !== undefined) {
    headers['content-type'] = init.contentType ?? 'application/json';
    payload = JSON.stringify(body);
  } else if (init.contentType) headers['content-type'] = init.contentType;
  const res = await fetch(`${baseUrl()}${path}`, { method, headers, body: payload, redirect: 'manual' });
  const text = await res.text();
  let parsed: unknown = text;
  try {
    parsed = text ? JSON.parse(text) : null;
  } catch {
    /* html or text */
  }
  return { status: res.status, body: parsed as T, headers: res.headers };
}

/** A multipart form with a file, as the intake screen sends it. */
export function fileForm(file: { name: string; text: string | Uint8Array; type?: string }, fields: Record<string, string>): FormData {
  const form = new FormData();
  form.set('file', new File([file.text as BlobPart], file.name, { type: file.type ?? 'text/csv' }));
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  return form;
}

/** Waits for a message to `to` whose subject matches, received by the local SMTP server. */
export async function waitForMail(to: string, subject: RegExp): Promise<{ to: string; subject: string; text: string; receivedAt: string | null }> {
  for (let i = 0; i < 40; i++) {
    const box = await call('admin', 'GET', '/api/outbox');
    const mail = box.body.items.find((m: { to: string; subject: string; receivedAt: string | null }) => m.to === to && subject.test(m.subject) && m.receivedAt);
    if (mail) return mail;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`no mail to ${to} matching ${subject}`);
}

/** A fresh account (created by the admin) whose password is set through the reset mail. */
export async function freshAccount(role: string, installations: string[] = [], password = 'a fresh test passphrase'): Promise<{ id: string; email: string; cookie: string }> {
  const email = `${role}.${Date.now()}.${Math.round(Math.random() * 1e6)}@example.test`;
  const created = await call('admin', 'POST', '/api/users', { email, name: 'Fresh Account', role, installations });
  if (created.status !== 201) throw new Error(`create ${email}: ${created.status} ${JSON.stringify(created.body)}`);
  const ask = await fetch(`${baseUrl()}/api/auth/request-password-reset`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: baseUrl() },
    body: JSON.stringify({ email, redirectTo: `${baseUrl()}/reset-password` }),
  });
  if (!ask.ok) throw new Error(`reset request ${ask.status}`);
  const mail = await waitForMail(email, /Reset your Plumbline password/);
  const link = /(http:\/\/\S+\/api\/auth\/reset-password\/\S+)/.exec(mail.text)![1]!;
  const follow = await fetch(link, { redirect: 'manual' });
  const token = new URL(follow.headers.get('location')!, baseUrl()).searchParams.get('token')!;
  const set = await fetch(`${baseUrl()}/api/auth/reset-password`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: baseUrl() },
    body: JSON.stringify({ token, newPassword: password }),
  });
  if (!set.ok) throw new Error(`reset ${set.status}`);
  return { id: created.body.id, email, cookie: await signIn(email, password) };
}
