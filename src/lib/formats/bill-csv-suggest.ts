/**
 * Suggests a column mapping from a bill file's headers, with a confidence per field, so the
 * intake screen can preselect the columns and the user only confirms. Headers are compared as
 * lower-case word lists ("Account/Meter" -> account meter, "Est?" -> est); an exact phrase
 * scores its listed confidence, a header that contains all of a phrase's words scores 85 % of
 * it. Each header serves one field and each field takes its best header. The phrase lists are
 * common practice in US utility exports.
 */
import type { Unit } from '../domain';
import { BILL_FIELDS, type BillField, type BillMapping, displayHeader, REQUIRED_BILL_FIELDS } from './bill-csv-mapping';
import { unitFromText } from './unit-text';

export interface FieldMatch {
  field: BillField;
  header: string;
  confidence: number;
}

export interface MappingSuggestion {
  mapping: Partial<BillMapping>;
  matches: FieldMatch[];
  /** Required fields no header matched. */
  missing: BillField[];
  /** The unit named by the quantity header itself ("kWh", "Usage (therms)"), if any. */
  impliedUnit: Unit | null;
}

type Phrase = readonly [string, number];

const UNIT_WORDS = ['kwh', 'mwh', 'therms', 'therm', 'ccf', 'hcf', 'mcf', 'gallons', 'gal', 'kgal', 'dth', 'mmbtu'];

const PHRASES: Record<BillField, readonly Phrase[]> = {
  meter: [
    ['meter', 0.9], ['meter id', 0.95], ['meter code', 0.95], ['meter number', 0.95], ['meter no', 0.9],
    ['meter #', 0.9], ['account meter', 0.85], ['service point', 0.7], ['meter name', 0.8],
    ['account', 0.5], ['account number', 0.55],
  ],
  periodStart: [
    ['start', 0.8], ['start date', 0.95], ['period start', 0.95], ['from', 0.85], ['from date', 0.9],
    ['service from', 0.9], ['service start', 0.9], ['bill start', 0.9], ['begin', 0.8], ['begin date', 0.9],
    ['previous read date', 0.85], ['prior read date', 0.85], ['start read date', 0.9],
  ],
  periodEnd: [
    ['end', 0.8], ['end date', 0.95], ['period end', 0.95], ['to', 0.8], ['to date', 0.9], ['through', 0.85],
    ['thru', 0.85], ['service to', 0.9], ['service end', 0.9], ['bill end', 0.9], ['read date', 0.75],
    ['current read date', 0.85], ['end read date', 0.9],
  ],
  quantity: [
    ['usage', 0.9], ['consumption', 0.9], ['quantity', 0.9], ['qty', 0.85], ['use', 0.8], ['total usage', 0.9],
    ['amount used', 0.85], ['units used', 0.85], ['volume', 0.7], ['billed usage', 0.9],
    ...UNIT_WORDS.map((w): Phrase => [w, 0.8]),
  ],
  unit: [['unit', 0.9], ['units', 0.85], ['uom', 0.9], ['unit of measure', 0.95], ['usage unit', 0.9]],
  cost: [
    ['cost', 0.9], ['amount', 0.75], ['total charges', 0.9], ['charges', 0.8], ['total cost', 0.95],
    ['bill amount', 0.9], ['amount due', 0.8], ['total amount', 0.85], ['current charges', 0.85], ['$', 0.7],
    ['total', 0.6],
  ],
  demand: [
    ['demand', 0.85], ['peak kw', 0.95], ['kw', 0.85], ['peak demand', 0.95], ['billed demand', 0.9],
    ['max kw', 0.9], ['demand kw', 0.95],
  ],
  estimated: [
    ['estimated', 0.9], ['est', 0.85], ['estimate', 0.85], ['read type', 0.75], ['actual estimated', 0.85],
    ['reading type', 0.7], ['estimated read', 0.9], ['e a', 0.7],
  ],
};

function words(header: string): string[] {
  return displayHeader(header)
    .toLowerCase()
    .replace(/[^a-z0-9$#]+/g, ' ')
    .trim()
    .split(' ')
    .filter((w) => w !== '');
}

function score(headerWords: readonly string[], phrase: Phrase): number {
  const phraseWords = phrase[0].split(' ');
  if (headerWords.join(' ') === phrase[0]) return phrase[1];
  return phraseWords.every((w) => headerWords.includes(w)) ? phrase[1] * 0.85 : 0;
}

/**
 * Suggests a mapping from headers.
 * @example suggestBillMapping(['Meter ID', 'From', 'To', 'kWh', 'Amount']).mapping
 *   // { meter: 'Meter ID', periodStart: 'From', periodEnd: 'To', quantity: 'kWh', cost: 'Amount' }
 */
export function suggestBillMapping(headers: readonly string[]): MappingSuggestion {
  const candidates: FieldMatch[] = [];
  headers.forEach((header) => {
    const w = words(header);
    if (w.length === 0) return;
    for (const field of BILL_FIELDS) {
      let best = 0;
      for (const phrase of PHRASES[field]) best = Math.max(best, score(w, phrase));
      if (best > 0) candidates.push({ field, header: displayHeader(header), confidence: Math.round(best * 100) / 100 });
    }
  });
  candidates.sort((a, b) => b.confidence - a.confidence || BILL_FIELDS.indexOf(a.field) - BILL_FIELDS.indexOf(b.field));
  const mapping: Partial<BillMapping> = {};
  const usedHeaders = new Set<string>();
  const matches: FieldMatch[] = [];
  for (const c of candidates) {
    if (mapping[c.field] !== undefined || usedHeaders.has(c.header)) continue;
    mapping[c.field] = c.header;
    usedHeaders.add(c.header);
    matches.push(c);
  }
  const ordered: Partial<BillMapping> = {};
  for (const field of BILL_FIELDS) if (mapping[field] !== undefined) ordered[field] = mapping[field];
  const quantityHeader = mapping.quantity;
  const impliedUnit =
    quantityHeader === undefined ? null : (words(quantityHeader).map(unitFromText).find((u) => u !== null) ?? null);
  return {
    mapping: ordered,
    matches: BILL_FIELDS.flatMap((f) => matches.filter((m) => m.field === f)),
    missing: REQUIRED_BILL_FIELDS.filter((f) => mapping[f] === undefined),
    impliedUnit,
  };
}
