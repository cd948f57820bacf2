/**
 * Progress of running imports, kept in this process for the page to poll (bytes read, rows
 * validated, rows stored). Entries are dropped ten minutes after they finish.
 */
export interface ImportProgress {
  phase: 'reading' | 'checking' | 'storing' | 'done' | 'failed';
  bytesRead: number;
  bytesTotal: number;
  rowsValidated: number;
  rowsStored: number;
  rowsToStore: number;
  message: string;
  updatedAt: number;
}

const KEY = Symbol.for('plumbline.import-progress');
type Holder = typeof globalThis & { [KEY]?: Map<string, ImportProgress> };
const holder = globalThis as Holder;
const registry = (holder[KEY] ??= new Map());

const KEEP_MS = 10 * 60_000;

export function progressKeyOk(key: string): boolean {
  return /^[A-Za-z0-9_-]{8,64}$/.test(key);
}

export function startProgress(key: string | undefined, bytesTotal: number): ImportProgress {
  const now = Date.now();
  for (const [k, p] of registry) if (now - p.updatedAt > KEEP_MS) registry.delete(k);
  const p: ImportProgress = { phase: 'reading', bytesRead: 0, bytesTotal, rowsValidated: 0, rowsStored: 0, rowsToStore: 0, message: '', updatedAt: now };
  if (key && progressKeyOk(key)) registry.set(key, p);
  return p;
}

export function touch(p: ImportProgress, patch: Partial<ImportProgress>): void {
  Object.assign(p, patch, { updatedAt: Date.now() });
}

export function getProgress(key: string): ImportProgress | null {
  return registry.get(key) ?? null;
}
