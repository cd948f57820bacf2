/** Display formatting shared by pages and islands (en-US conventions, figures in tabular digits). */

const nf0 = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
const nf1 = new Intl.NumberFormat('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
const usd = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD', maximumFractionDigits: 0 });

export function formatNumber(v: number | null | undefined, digits = 0): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  if (digits === 0) return nf0.format(v);
  if (digits === 1) return nf1.format(v);
  return new Intl.NumberFormat('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits }).format(v);
}

export function formatMoney(v: number | null | undefined): string {
  return v === null || v === undefined || !Number.isFinite(v) ? '—' : usd.format(v);
}

export function formatPercent(fraction: number | null | undefined, digits = 0): string {
  return fraction === null || fraction === undefined || !Number.isFinite(fraction) ? '—' : `${formatNumber(fraction * 100, digits)} %`;
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** `2026-03-15` → `15 Mar 2026`. */
export function formatDate(iso: string | null | undefined): string {
  if (!iso) return '—';
  const [y, m, d] = iso.slice(0, 10).split('-').map(Number);
  return `${d} ${MONTHS[(m ?? 1) - 1]} ${y}`;
}

/** `2026-03-15` → `Mar 2026`. */
export function formatMonth(iso: string | null | undefined): string {
  if (!iso) return '—';
  const [y, m] = iso.slice(0, 10).split('-').map(Number);
  return `${MONTHS[(m ?? 1) - 1]} ${y}`;
}

/** Whole months between an ISO date and today's ISO date (for data freshness). */
export function monthsBetween(fromIso: string, toIso: string): number {
  const [fy, fm] = fromIso.split('-').map(Number);
  const [ty, tm] = toIso.split('-').map(Number);
  return (ty! - fy!) * 12 + (tm! - fm!);
}
