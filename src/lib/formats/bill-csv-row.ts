/**
 * Validates one bill CSV record (already split into cells) against a resolved column mapping
 * and returns either a normalized bill row or the problems that keep it out. Checks made here
 * are the ones a single row can answer: blank or unreadable cells, impossible and future dates,
 * reversed periods, negative use, zero electricity, cost without quantity, unknown units and
 * meters, units that do not fit the meter, unreadable estimated flags. Checks that need the
 * whole series of a meter (overlaps, gaps, period lengths, outliers) belong to the bills module.
 *
 * Built for a million rows: column indexes are resolved once, cells are read by position, dates
 * and numbers go through hand-written scanners (no regular expressions, no Date objects) and a
 * clean row allocates only its result.
 */
import { type Commodity, COMMODITY_UNITS, type Unit } from '../domain';
import type { ResolvedBillMapping } from './bill-csv-mapping';
import { type DateCellFailure, DEFAULT_TWO_DIGIT_YEAR_PIVOT, parseDateCell } from './cell-date';
import { type DecimalMark, parseNumberCell } from './cell-number';
import { quoteValue, type RowProblem, type RowProblemCode, type Severity } from './problems';
import { unitFromText } from './unit-text';

/** What the importer knows about a meter of the installation. */
export interface MeterInfo {
  commodity?: Commodity | undefined;
  /** Unit used when a row states none. */
  defaultUnit?: Unit | undefined;
  /** Units the meter may be billed in; by default those of its commodity (COMMODITY_UNITS). */
  units?: readonly Unit[] | undefined;
}

export interface BillRowContext {
  decimalMark: DecimalMark;
  /** Two-digit years below this are 20yy (default 69, the POSIX `%y` rule). */
  twoDigitYearPivot?: number | undefined;
  /** Today's date (ISO); a period ending after it is refused as a future date. */
  today?: string | undefined;
  /** Known meters by code. Without it, meters and meter units are not checked. */
  meters?: ReadonlyMap<string, MeterInfo> | undefined;
  /** Unit for the whole file when neither the row nor the meter states one. */
  defaultUnit?: Unit | undefined;
}

export interface NormalizedBillRow {
  meterCode: string;
  periodStart: string;
  periodEnd: string;
  quantity: number;
  unit: Unit | undefined;
  cost: number | undefined;
  demandKw: number | undefined;
  estimated: boolean;
}

export type BillRowResult =
  | { ok: true; row: NormalizedBillRow; warnings: readonly RowProblem[] }
  | { ok: false; problems: readonly RowProblem[] };

const NO_PROBLEMS: readonly RowProblem[] = Object.freeze([]);

const FLAGS: ReadonlyMap<string, boolean> = new Map([
  ...['y', 'yes', 'true', 't', '1', 'e', 'est', 'estimated', 'estimate'].map((k) => [k, true] as const),
  ...['n', 'no', 'false', 'f', '0', 'a', 'act', 'actual'].map((k) => [k, false] as const),
]);

function add(
  list: RowProblem[] | null,
  row: number,
  column: string,
  code: RowProblemCode,
  message: string,
  severity: Severity = 'error',
): RowProblem[] {
  const problem: RowProblem = { row, column, code, message, severity };
  if (list === null) return [problem];
  list.push(problem);
  return list;
}

function cell(record: readonly (string | undefined)[], index: number): string {
  if (index < 0) return '';
  const raw = record[index];
  return raw === undefined ? '' : raw.trim();
}

function hasErrors(list: readonly RowProblem[]): boolean {
  for (const p of list) if (p.severity === 'error') return true;
  return false;
}

/**
 * Validates one record.
 * @param record the record's cells in file order
 * @param m the mapping resolved against the file's header (resolveBillMapping)
 * @param line the file line the record starts on (the header is line 1)
 * @example validateBillRow(['M-1', '1/1/2024', '1/31/2024', '1,234'], m, 2, { decimalMark: 'point' })
 *   // { ok: true, row: { meterCode: 'M-1', periodStart: '2024-01-01', periodEnd: '2024-01-31', quantity: 1234, ... } }
 */
export function validateBillRow(
  record: readonly (string | undefined)[],
  m: ResolvedBillMapping,
  line: number,
  ctx: BillRowContext,
): BillRowResult {
  const { index, header } = m;
  let problems: RowProblem[] | null = null;
  const pivot = ctx.twoDigitYearPivot ?? DEFAULT_TWO_DIGIT_YEAR_PIVOT;

  const meterCode = cell(record, index.meter);
  let meter: MeterInfo | undefined;
  if (meterCode === '') {
    problems = add(problems, line, header.meter, 'missing-value', 'Meter is blank; every row needs a meter code.');
  } else if (ctx.meters !== undefined) {
    meter = ctx.meters.get(meterCode);
    if (meter === undefined) {
      problems = add(problems, line, header.meter, 'unknown-meter', `Meter ${quoteValue(meterCode)} is not a meter of this installation.`);
    }
  }

  let periodStart = '';
  let periodEnd = '';
  const startRaw = cell(record, index.periodStart);
  const startParsed = startRaw === '' ? null : parseDateCell(startRaw, pivot);
  if (startParsed === null) problems = add(problems, line, header.periodStart, 'missing-value', 'Period start is blank.');
  else if (startParsed.ok) periodStart = startParsed.iso;
  else problems = dateProblem(problems, line, header.periodStart, 'Period start', startRaw, startParsed);
  const endRaw = cell(record, index.periodEnd);
  const endParsed = endRaw === '' ? null : parseDateCell(endRaw, pivot);
  if (endParsed === null) problems = add(problems, line, header.periodEnd, 'missing-value', 'Period end is blank.');
  else if (endParsed.ok) periodEnd = endParsed.iso;
  else problems = dateProblem(problems, line, header.periodEnd, 'Period end', endRaw, endParsed);
  if (periodStart !== '' && periodEnd !== '' && periodEnd < periodStart) {
    problems = add(problems, line, header.periodEnd, 'period-reversed', `Period end ${periodEnd} is before period start ${periodStart}.`);
  }
  if (periodEnd !== '' && ctx.today !== undefined && periodEnd > ctx.today) {
    problems = add(problems, line, header.periodEnd, 'future-date', `Period end ${periodEnd} is in the future (today is ${ctx.today}).`);
  }

  const quantityRaw = cell(record, index.quantity);
  const costRaw = cell(record, index.cost);
  let quantity = 0;
  if (quantityRaw === '') {
    problems =
      costRaw !== ''
        ? add(problems, line, header.quantity, 'cost-without-quantity', `Cost ${quoteValue(costRaw)} is given but quantity is blank.`)
        : add(problems, line, header.quantity, 'missing-value', 'Quantity is blank.');
  } else {
    const parsed = parseNumberCell(quantityRaw, ctx.decimalMark);
    if (!parsed.ok) {
      problems = add(problems, line, header.quantity, 'bad-number', `Quantity ${quoteValue(quantityRaw)} ${parsed.why}.`);
    } else {
      quantity = parsed.value;
      if (parsed.ambiguous) problems = ambiguous(problems, line, header.quantity, 'Quantity', quantityRaw, quantity);
      if (quantity < 0) {
        problems = add(problems, line, header.quantity, 'negative-quantity',
          `Quantity ${quoteValue(quantityRaw)} is negative: a correction or net metering? Check the bill.`, 'warning');
      } else if (quantity === 0 && meter?.commodity === 'electricity') {
        // CalTRACK 2.0 §2.2.1.3: a zero electricity bill is treated as missing data.
        problems = add(problems, line, header.quantity, 'zero-electricity',
          'Quantity is 0 on an electricity meter; a zero electricity bill usually means a missing read.', 'warning');
      }
    }
  }

  let unit: Unit | undefined;
  const unitRaw = cell(record, index.unit);
  if (unitRaw !== '') {
    const parsed = unitFromText(unitRaw);
    if (parsed === null) {
      problems = add(problems, line, header.unit, 'unknown-unit',
        `Unit ${quoteValue(unitRaw)} is not a unit this import knows (for example kWh, MWh, therm, ccf, gal, kgal, m3, lb).`);
    } else if (parsed === 'kW') {
      problems = add(problems, line, header.unit, 'demand-unit-as-quantity',
        `Unit ${quoteValue(unitRaw)} is demand, not use; map peak kW to the demand column.`);
    } else unit = parsed;
  } else {
    unit = meter?.defaultUnit ?? ctx.defaultUnit;
    if (unit === undefined && meter !== undefined) {
      problems = add(problems, line, header.unit, 'missing-unit', `Unit is blank and meter ${quoteValue(meterCode)} has no default unit.`);
    }
  }
  const allowed = meter?.units ?? (meter?.commodity === undefined ? undefined : COMMODITY_UNITS[meter.commodity]);
  if (unit !== undefined && allowed !== undefined && !allowed.includes(unit)) {
    problems = add(problems, line, header.unit, 'unit-not-valid-for-meter',
      `Unit ${unit} does not fit meter ${quoteValue(meterCode)}, which is billed in ${allowed.join(', ')}.`);
  }

  let cost: number | undefined;
  if (costRaw !== '') {
    const parsed = parseNumberCell(costRaw, ctx.decimalMark);
    if (!parsed.ok) problems = add(problems, line, header.cost, 'bad-number', `Cost ${quoteValue(costRaw)} ${parsed.why}.`);
    else {
      cost = parsed.value;
      if (parsed.ambiguous) problems = ambiguous(problems, line, header.cost, 'Cost', costRaw, cost);
    }
  }

  let demandKw: number | undefined;
  const demandRaw = cell(record, index.demand);
  if (demandRaw !== '') {
    const parsed = parseNumberCell(demandRaw, ctx.decimalMark);
    if (!parsed.ok) problems = add(problems, line, header.demand, 'bad-number', `Demand ${quoteValue(demandRaw)} ${parsed.why}.`);
    else if (parsed.value < 0) problems = add(problems, line, header.demand, 'negative-demand', `Demand ${quoteValue(demandRaw)} is negative.`);
    else {
      demandKw = parsed.value;
      if (parsed.ambiguous) problems = ambiguous(problems, line, header.demand, 'Demand', demandRaw, demandKw);
    }
  }

  let estimated = false;
  const flagRaw = cell(record, index.estimated);
  if (flagRaw !== '') {
    const flag = FLAGS.get(flagRaw.toLowerCase());
    if (flag === undefined) {
      problems = add(problems, line, header.estimated, 'bad-estimated-flag',
        `Estimated ${quoteValue(flagRaw)} is not one of Y/N, yes/no, true/false, 1/0, E/A; read as not estimated.`, 'warning');
    } else estimated = flag;
  }

  if (problems !== null && hasErrors(problems)) return { ok: false, problems };
  return {
    ok: true,
    row: { meterCode, periodStart, periodEnd, quantity, unit, cost, demandKw, estimated },
    warnings: problems ?? NO_PROBLEMS,
  };
}

function dateProblem(
  list: RowProblem[] | null,
  line: number,
  column: string,
  label: string,
  raw: string,
  parsed: { code: DateCellFailure; why: string },
): RowProblem[] {
  const text =
    parsed.code === 'bad-date'
      ? `${label} ${quoteValue(raw)} is not a date this import can read; ${parsed.why}.`
      : `${label} ${quoteValue(raw)} is not a real date: ${parsed.why}.`;
  return add(list, line, column, parsed.code, text);
}

function ambiguous(list: RowProblem[] | null, line: number, column: string, label: string, raw: string, value: number): RowProblem[] {
  return add(list, line, column, 'ambiguous-number',
    `${label} ${quoteValue(raw)} could be read two ways; it was read as ${value}. Write it without thousands separators to be sure.`, 'warning');
}
