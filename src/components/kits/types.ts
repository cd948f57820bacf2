/** The kit library API's answers as the islands read them (shapes shared with src/server/kits). */
import type { KitInstrument, KitViewer, LoanEventRow, LoanRow } from '../../lib/kits/api-types';

export type { CalendarEntry, HistoryEntry, Hold, KitDetail, KitSummary } from '../../lib/kits/api-types';
export type Instrument = KitInstrument;
export type Loan = LoanRow;
export type LoanEvent = LoanEventRow;
export interface LoanDetail extends LoanRow {
  events: LoanEventRow[];
}

/** An instrument as GET /api/instruments lists it, with its kit. */
export interface InstrumentListed extends KitInstrument {
  kitCode: string | null;
  kitName: string | null;
}

/** What the page tells the islands about the person looking (src/server/kits/viewer.ts). */
export type Viewer = KitViewer;
