/** Words and badge colours for walkthroughs and measures, shared by the islands. */
import type { MeasureStatus, WalkthroughStatus } from '../../lib/field/walkthrough-form';

export const WALKTHROUGH_BADGE: Record<WalkthroughStatus, { label: string; cls: string }> = {
  planned: { label: 'planned', cls: 'bg-ink-100 text-ink-800' },
  'in-progress': { label: 'in progress', cls: 'bg-amber-soft text-amber-ink' },
  completed: { label: 'completed', cls: 'bg-line-50 text-line-800' },
  cancelled: { label: 'cancelled', cls: 'bg-ink-200 text-ink-700' },
};

export const MEASURE_BADGE: Record<MeasureStatus, { label: string; cls: string }> = {
  proposed: { label: 'proposed', cls: 'bg-ink-100 text-ink-800' },
  approved: { label: 'approved', cls: 'bg-amber-soft text-amber-ink' },
  implemented: { label: 'implemented', cls: 'bg-line-50 text-line-800' },
  rejected: { label: 'rejected', cls: 'bg-brick-soft text-brick-ink' },
};

/** `rooftop-unit` → `Rooftop unit`. */
export function humanize(code: string): string {
  const s = code.replace(/[-_]/g, ' ');
  return s.charAt(0).toUpperCase() + s.slice(1);
}

export function options<const T extends readonly string[]>(codes: T, labels?: Partial<Record<T[number], string>>): { value: T[number]; label: string }[] {
  return codes.map((c) => ({ value: c, label: labels?.[c as T[number]] ?? humanize(c) }));
}
