/**
 * The shapes the kit library's API answers with, shared by the services that build them
 * (src/server/kits) and the islands that read them (src/components/kits).
 */
import type { CalibrationStatus } from './calibration';
import type { LoanStatus } from './loan-states';

export interface KitInstrument {
  id: string;
  kitId: string | null;
  type: string;
  model: string;
  serial: string;
  calibrationDue: string | null;
  condition: string;
  notes: string;
  /** On today's date (UTC). */
  calibration: CalibrationStatus;
}

/** A loan's dates and status, without saying whose it is. */
export interface Hold {
  start: string;
  end: string;
  status: LoanStatus;
}

export interface KitFields {
  id: string;
  code: string;
  name: string;
  description: string;
  homeLocation: string;
  active: boolean;
}

export interface KitSummary extends KitFields {
  instruments: KitInstrument[];
  instrumentTypes: string[];
  /** For the range asked for: null without a range. */
  available: boolean | null;
  /** Why the kit is not available for the range (empty otherwise). */
  unavailableBecause: string[];
  /** Every instrument within calibration today. */
  calibrationOk: boolean;
  /** The loan holding the kit today, or the next one. */
  now: Hold | null;
  next: Hold | null;
}

export interface CalendarEntry extends Hold {
  /** The loan's details when the caller may see its installation; null otherwise (dates only). */
  loan: { id: string; ref: string; purpose: string; installationCode: string | null } | null;
}

export interface KitDetail extends KitFields {
  createdAt: string;
  today: string;
  instruments: KitInstrument[];
  calibrationOk: boolean;
  window: { from: string; to: string };
  calendar: CalendarEntry[];
}

export interface LoanRow {
  id: string;
  ref: string;
  kitId: string;
  kitCode: string;
  kitName: string;
  installationCode: string | null;
  walkthrough: { id: string; title: string; plannedOn: string | null } | null;
  requestedBy: { id: string; name: string } | null;
  purpose: string;
  start: string;
  end: string;
  days: number;
  status: LoanStatus;
  statusLabel: string;
  /** Out (shipped or in use) after its last day. */
  overdue: boolean;
  createdAt: string;
  updatedAt: string;
  /** What the caller may do next: `{ to, verb }`. */
  moves: { to: LoanStatus; verb: string }[];
}

export interface LoanEventRow {
  id: string;
  from: LoanStatus | null;
  to: LoanStatus;
  userId: string | null;
  by: string;
  note: string;
  at: string;
}

export interface HistoryEntry {
  at: string;
  kind: 'created' | 'moved' | 'calibration' | 'condition' | 'updated' | 'loan';
  text: string;
  by: string | null;
  loan: { id: string; ref: string; start: string; end: string; status: LoanStatus } | null;
}

/** What the kit library's pages tell their islands about the person looking. */
export interface KitViewer {
  id: string;
  canManageKits: boolean;
  canManageLoans: boolean;
  canRequest: boolean;
  scoped: boolean;
  installations: { code: string; name: string }[];
  today: string;
}
