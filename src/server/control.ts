/**
 * A local control channel for the command line while the server runs on the embedded database:
 * the server writes `control.json` (its URL and a random token, mode 0600) into the data folder,
 * and accepts the token, from a loopback address only, on the few routes in CONTROL_ROUTES. A
 * command that can read the data folder could read the database files anyway, so the token grants
 * nothing new; it lets the command ask the one process that owns the database to act.
 */
import { randomBytes, timingSafeEqual } from 'node:crypto';
import { existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { dataDir, MEMORY } from '../db/paths';
import type { Actor } from './authz';

export const CONTROL_HEADER = 'x-plumbline-control';
export const CONTROL_ROUTES: ReadonlySet<string> = new Set(['/api/admin/backup']);
const FILE = 'control.json';

// Kept on globalThis: the server entry (run from source) writes it, the built app's middleware reads it.
const KEY = Symbol.for('plumbline.control-token');
type Holder = typeof globalThis & { [KEY]?: string | null };
const holder = globalThis as Holder;

export interface ControlInfo {
  url: string;
  token: string;
  pid: number;
}

/** Called by the server entry once it listens. */
export function writeControlFile(url: string): void {
  const dir = dataDir();
  if (dir === MEMORY) return;
  const token = randomBytes(32).toString('hex');
  holder[KEY] = token;
  writeFileSync(join(dir, FILE), JSON.stringify({ url, token, pid: process.pid } satisfies ControlInfo), { mode: 0o600 });
}

export function removeControlFile(): void {
  const dir = dataDir();
  if (dir === MEMORY || !holder[KEY]) return;
  rmSync(join(dir, FILE), { force: true });
  holder[KEY] = null;
}

/** What the command line reads to reach the running server. */
export function readControlFile(dir: string): ControlInfo | null {
  const f = join(dir, FILE);
  if (!existsSync(f)) return null;
  try {
    return JSON.parse(readFileSync(f, 'utf8')) as ControlInfo;
  } catch {
    return null;
  }
}

function isLoopback(address: string): boolean {
  return address === '127.0.0.1' || address === '::1' || address === '::ffff:127.0.0.1';
}

/** The system actor when the request carries this server's control token from loopback, on a control route. */
export function controlActor(path: string, headers: Headers, clientAddress: string): Actor | null {
  const token = holder[KEY];
  if (!token || !CONTROL_ROUTES.has(path)) return null;
  const given = headers.get(CONTROL_HEADER);
  if (!given || !isLoopback(clientAddress)) return null;
  const a = Buffer.from(given);
  const b = Buffer.from(token);
  if (a.length !== b.length || !timingSafeEqual(a, b)) return null;
  return { id: 'control', email: 'command line', name: 'command line (local)', role: 'admin', installationIds: [], scoped: false };
}
