/**
 * The loan state machine. The exclusion constraint's status list is read from the migration
 * itself, so the holding states here cannot drift from what the database enforces.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { HOLDING_STATUSES, LOAN_MOVES, LOAN_STATUSES, movesFor, nextStatuses } from '../../../src/lib/kits/loan-states';

const nobody = { custodian: false, requester: false, borrower: false };

describe('loan states', () => {
  it('holding states are exactly the statuses of the exclusion constraint in drizzle/0012', () => {
    const sql = readFileSync(join(import.meta.dirname, '..', '..', '..', 'drizzle', '0012_loan_no_double_booking.sql'), 'utf8');
    const list = /"status" IN \(([^)]*)\)/.exec(sql)![1]!.match(/'([^']+)'/g)!.map((s) => s.slice(1, -1));
    expect([...HOLDING_STATUSES].sort()).toEqual(list.sort());
  });

  it('the forward path reaches inspected; declined and cancelled branch off early', () => {
    const path = ['requested', 'approved', 'shipped', 'in-use', 'returned', 'inspected'] as const;
    for (let k = 0; k + 1 < path.length; k++) expect(nextStatuses(path[k]!)).toContain(path[k + 1]);
    expect(nextStatuses('requested').sort()).toEqual(['approved', 'cancelled', 'declined']);
    expect(nextStatuses('approved').sort()).toEqual(['cancelled', 'shipped']);
    for (const s of ['inspected', 'declined', 'cancelled'] as const) expect(nextStatuses(s)).toEqual([]);
  });

  it('every status is reachable from requested', () => {
    const seen = new Set(['requested']);
    for (let changed = true; changed; ) {
      changed = false;
      for (const m of LOAN_MOVES) if (seen.has(m.from) && !seen.has(m.to)) (seen.add(m.to), (changed = true));
    }
    expect([...seen].sort()).toEqual([...LOAN_STATUSES].sort());
  });

  it('offers each party only its moves', () => {
    expect(movesFor('requested', { ...nobody, requester: true }).map((m) => m.to)).toEqual(['cancelled']);
    expect(movesFor('requested', { ...nobody, custodian: true }).map((m) => m.to)).toEqual(['approved', 'declined', 'cancelled']);
    expect(movesFor('shipped', { ...nobody, borrower: true }).map((m) => m.to)).toEqual(['in-use']);
    expect(movesFor('shipped', { ...nobody, requester: true }).map((m) => m.to)).toEqual(['in-use']);
    expect(movesFor('in-use', { ...nobody, requester: true })).toEqual([]);
    expect(movesFor('approved', nobody)).toEqual([]);
  });

  it('only moves that send the kit out check its instruments', () => {
    expect(LOAN_MOVES.filter((m) => m.checksInstruments).map((m) => m.to).sort()).toEqual(['approved', 'shipped']);
  });
});
