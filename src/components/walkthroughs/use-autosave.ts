/**
 * Autosave of the field form: edits are kept in this browser (localStorage) at once, sent a
 * moment later as the changed sections with the form version they were made on, and cleared from
 * the browser only once the server has them. A save on an older version comes back 409: the
 * edits stay, and the person chooses to apply them on top of the newer version or drop them.
 * Offline, edits wait on the device and go when the connection returns.
 */
import { useCallback, useEffect, useRef, useState } from 'react';
import { SECTION_IDS, type SectionId, type WalkthroughForm } from '../../lib/field/walkthrough-form';
import { formSectionsSchema } from '../../lib/field/walkthrough-api';
import { api, ApiError } from '../ui/api';

export type SaveState = 'saved' | 'unsaved' | 'saving' | 'offline' | 'conflict' | 'invalid' | 'error' | 'closed';

interface Draft {
  baseVersion: number;
  sections: Partial<WalkthroughForm>;
  at: string;
}

interface Saved {
  formVersion: number;
  status: string;
  updatedAt: string;
  progress: { completed: number; total: number };
}

const DEBOUNCE_MS = 1200;
const RETRY_MS = 8000;
export const draftKey = (id: string) => `plumbline:walkthrough:${id}:draft`;

function readDraft(id: string): Draft | null {
  try {
    const raw = localStorage.getItem(draftKey(id));
    return raw ? (JSON.parse(raw) as Draft) : null;
  } catch {
    return null;
  }
}

export function useAutosave(opts: { id: string; form: WalkthroughForm; version: number; editable: boolean; onSaved: (s: Saved) => void }) {
  const [form, setForm] = useState<WalkthroughForm>(opts.form);
  const [state, setState] = useState<SaveState>(opts.editable ? 'saved' : 'closed');
  const [message, setMessage] = useState<string | null>(null);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const [savedAt, setSavedAt] = useState<string | null>(null);
  const [draftAt, setDraftAt] = useState<string | null>(null);
  const version = useRef(opts.version);
  const formRef = useRef(form);
  const dirty = useRef(new Set<SectionId>());
  const inFlight = useRef(false);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const stateRef = useRef(state);
  /** State in a ref too, so that async code reads the latest one. */
  const put = useCallback((s: SaveState) => {
    stateRef.current = s;
    setState(s);
  }, []);
  const onSaved = useRef(opts.onSaved);
  onSaved.current = opts.onSaved;

  const keepDraft = useCallback(() => {
    if (dirty.current.size === 0) {
      localStorage.removeItem(draftKey(opts.id));
      return;
    }
    const sections = Object.fromEntries([...dirty.current].map((s) => [s, formRef.current[s]]));
    const at = new Date().toISOString();
    try {
      localStorage.setItem(draftKey(opts.id), JSON.stringify({ baseVersion: version.current, sections, at } satisfies Draft));
    } catch {
      /* storage full or blocked: the edits are still in the page */
    }
  }, [opts.id]);

  const save = useCallback(async (): Promise<void> => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    if (inFlight.current || dirty.current.size === 0 || stateRef.current === 'conflict' || stateRef.current === 'closed') return;
    const sent = Object.fromEntries([...dirty.current].map((s) => [s, formRef.current[s]])) as Partial<WalkthroughForm>;
    const check = formSectionsSchema.safeParse(sent);
    if (!check.success) {
      setFieldErrors(Object.fromEntries(check.error.issues.map((i) => [i.path.join('.'), i.message])));
      put('invalid');
      return;
    }
    setFieldErrors({});
    inFlight.current = true;
    put('saving');
    try {
      const r = await api<Saved>(`/api/walkthroughs/${opts.id}`, { method: 'PATCH', body: { formVersion: version.current, form: sent } });
      version.current = r.formVersion;
      // Sections edited again while the save was on its way stay dirty.
      for (const s of Object.keys(sent) as SectionId[]) if (formRef.current[s] === sent[s]) dirty.current.delete(s);
      keepDraft();
      setSavedAt(r.updatedAt);
      setMessage(null);
      put(dirty.current.size ? 'unsaved' : 'saved');
      onSaved.current(r);
    } catch (e) {
      const err = e instanceof ApiError ? e : null;
      const reason = (err?.details as { reason?: string } | null)?.reason;
      if (err?.status === 0) put('offline');
      else if (err?.status === 409 && reason === 'stale-version') put('conflict');
      else if (err?.status === 409 && reason === 'not-editable') put('closed');
      else if (err?.status === 400) {
        setFieldErrors(Object.fromEntries(Object.entries(err.fields).map(([k, v]) => [k.replace(/^form\./, ''), v])));
        put('invalid');
      } else put('error');
      setMessage(err?.message ?? String(e));
    } finally {
      inFlight.current = false;
    }
    if (dirty.current.size && (stateRef.current === 'unsaved' || stateRef.current === 'offline' || stateRef.current === 'error')) {
      timer.current = setTimeout(() => void save(), stateRef.current === 'unsaved' ? DEBOUNCE_MS : RETRY_MS);
    }
  }, [opts.id, keepDraft, put]);

  const setSection = useCallback(
    <K extends SectionId>(id: K, value: WalkthroughForm[K]) => {
      if (stateRef.current === 'closed') return;
      const next = { ...formRef.current, [id]: value };
      formRef.current = next;
      setForm(next);
      dirty.current.add(id);
      keepDraft();
      if (stateRef.current !== 'conflict') {
        put(navigator.onLine === false ? 'offline' : 'unsaved');
        if (timer.current) clearTimeout(timer.current);
        timer.current = setTimeout(() => void save(), DEBOUNCE_MS);
      }
    },
    [keepDraft, save, put],
  );

  /** Takes the server's newer form; `keepMine` lays this device's unsaved sections over it and saves them. */
  const resolve = useCallback(
    async (keepMine: boolean) => {
      const w = await api<{ form: WalkthroughForm; formVersion: number; status: string }>(`/api/walkthroughs/${opts.id}`);
      version.current = w.formVersion;
      const mine = Object.fromEntries([...dirty.current].map((s) => [s, formRef.current[s]]));
      const next = keepMine ? { ...w.form, ...mine } : w.form;
      if (!keepMine) dirty.current.clear();
      formRef.current = next;
      setForm(next);
      keepDraft();
      const editable = w.status === 'planned' || w.status === 'in-progress';
      put(editable ? (dirty.current.size ? 'unsaved' : 'saved') : 'closed');
      setMessage(null);
      setDraftAt(null);
      if (editable && dirty.current.size) await save();
    },
    [opts.id, keepDraft, save, put],
  );

  // On open: edits left in this browser by an earlier visit.
  useEffect(() => {
    const d = readDraft(opts.id);
    if (!d || !opts.editable) return;
    const sections = Object.fromEntries(Object.entries(d.sections).filter(([k]) => (SECTION_IDS as readonly string[]).includes(k))) as Partial<WalkthroughForm>;
    if (Object.keys(sections).length === 0) return;
    for (const s of Object.keys(sections) as SectionId[]) dirty.current.add(s);
    const next = { ...formRef.current, ...sections };
    formRef.current = next;
    setForm(next);
    setDraftAt(d.at);
    if (d.baseVersion === version.current) {
      put('unsaved');
      timer.current = setTimeout(() => void save(), 300);
    } else {
      put('conflict');
      setMessage('Edits made on this device were not saved, and the walkthrough has been saved from somewhere else since.');
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  useEffect(() => {
    const online = () => {
      if (stateRef.current === 'offline') void save();
    };
    const offline = () => {
      if (dirty.current.size) put('offline');
    };
    const leaving = (e: BeforeUnloadEvent) => {
      if (dirty.current.size) e.preventDefault();
    };
    window.addEventListener('online', online);
    window.addEventListener('offline', offline);
    window.addEventListener('beforeunload', leaving);
    return () => {
      window.removeEventListener('online', online);
      window.removeEventListener('offline', offline);
      window.removeEventListener('beforeunload', leaving);
      if (timer.current) clearTimeout(timer.current);
    };
  }, [save, put]);

  return { form, setSection, state, message, fieldErrors, savedAt, draftAt, saveNow: save, resolve, dirtyCount: () => dirty.current.size };
}
