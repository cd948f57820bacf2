/**
 * Reads a number cell from a utility export: currency symbols and codes (`$`, `US$`, `USD`,
 * `€`, `EUR`, `£`, `GBP`, `CAD`), a sign before or after the currency, parentheses or a
 * trailing minus as negative (accounting style), thousands separators and a decimal mark.
 * One pass over the characters, no regular expressions.
 *
 * Decimal marks (`DecimalMark`):
 * - `point` (comma- and tab-separated files): `.` is the decimal mark, `,` groups thousands;
 * - `comma`: `,` is the decimal mark, `.` groups thousands ("1.234,5");
 * - `auto` (the default for `;`-separated files, where European exports use a decimal comma):
 *   with both marks present the later one is the decimal mark ("1.234,5" and "1,234.5" both
 *   read 1234.5); one mark that appears once is the decimal mark ("12,5" is 12.5); a mark that
 *   repeats groups thousands ("1.234.567"). A single mark followed by exactly three digits
 *   ("1,234") is read as a decimal mark and reported as ambiguous.
 * Spaces (also no-break and narrow no-break spaces) may group thousands in every mode.
 * Thousands groups must have three digits ("1,23" is refused, not guessed).
 */

export type DecimalMark = 'point' | 'comma' | 'auto';
export type NumberCellResult = { ok: true; value: number; ambiguous: boolean } | { ok: false; why: string };

const C_0 = 48;
const C_9 = 57;
const C_COMMA = 44;
const C_DOT = 46;
const C_MINUS = 45;
const C_PLUS = 43;
const C_UNICODE_MINUS = 0x2212;
const C_LPAREN = 40;
const C_RPAREN = 41;
const CURRENCY_CODES = ['US$', 'C$', 'USD', 'EUR', 'GBP', 'CAD'];
const CURRENCY_CODES_LOWER = CURRENCY_CODES.map((c) => c.toLowerCase());

// Clinger's fast path: with at most 15 significant digits and at most 22 fraction digits both the
// digit string and the power of ten are exact doubles, so one division rounds correctly.
// Source: W. D. Clinger, "How to Read Floating Point Numbers Accurately", PLDI 1990.
const MAX_EXACT_DIGITS = 15;
const POW10: readonly number[] = Array.from({ length: 23 }, (_, k) => 10 ** k);

const NOT_A_NUMBER = 'is not a number';
const WRONG_GROUPS = 'has thousands separators in the wrong places';

function isDigit(c: number): boolean {
  return c >= C_0 && c <= C_9;
}

/** Space, no-break space, narrow no-break space, thin space. */
function isSpace(c: number): boolean {
  return c === 0x20 || c === 0xa0 || c === 0x202f || c === 0x2009;
}

/** $ € £ */
function isCurrencySymbol(c: number): boolean {
  return c === 0x24 || c === 0x20ac || c === 0xa3;
}

function isLetterOrDollar(c: number): boolean {
  return (c >= 65 && c <= 90) || (c >= 97 && c <= 122);
}

function codeLengthAt(s: string, from: number, to: number, atEnd: boolean): number {
  for (let k = 0; k < CURRENCY_CODES.length; k++) {
    const code = CURRENCY_CODES[k] ?? '';
    if (to - from < code.length) continue;
    const at = atEnd ? to - code.length : from;
    if (s.startsWith(code, at) || s.startsWith(CURRENCY_CODES_LOWER[k] ?? '', at)) return code.length;
  }
  return 0;
}

/**
 * The common case first: an optional minus, digits, at most one decimal point (or comma in
 * `comma` mode) and nothing else. Returns null when the cell needs the full reader.
 */
function plainNumber(raw: string, start: number, end: number, mark: DecimalMark): NumberCellResult | null {
  let i = start;
  const negative = raw.charCodeAt(i) === C_MINUS;
  if (negative) i++;
  let digits = 0;
  let mantissa = 0;
  let markAt = -1;
  for (; i < end; i++) {
    const c = raw.charCodeAt(i);
    if (isDigit(c)) {
      digits++;
      mantissa = mantissa * 10 + (c - C_0);
    } else if (markAt < 0 && ((c === C_DOT && mark !== 'comma') || (c === C_COMMA && mark !== 'point'))) markAt = i;
    else return null;
  }
  if (digits === 0) return null;
  const fractionDigits = markAt < 0 ? 0 : end - markAt - 1;
  let value: number;
  if (digits <= MAX_EXACT_DIGITS && fractionDigits < POW10.length) {
    value = fractionDigits === 0 ? mantissa : mantissa / (POW10[fractionDigits] ?? 1);
  } else {
    const unsigned = markAt < 0 ? raw.slice(negative ? start + 1 : start, end)
      : `${raw.slice(negative ? start + 1 : start, markAt)}.${raw.slice(markAt + 1, end)}`;
    value = Number(unsigned.startsWith('.') ? `0${unsigned}` : unsigned);
    if (!Number.isFinite(value)) return { ok: false, why: 'is too large' };
  }
  const intLen = markAt - start - (negative ? 1 : 0);
  const ambiguous =
    mark === 'auto' && markAt >= 0 && fractionDigits === 3 && intLen >= 1 && intLen <= 3 && raw.charCodeAt(markAt - intLen) !== C_0;
  return { ok: true, value: negative && value !== 0 ? -value : value, ambiguous };
}

/**
 * Parses one number cell; the caller handles a blank cell.
 * @example parseNumberCell('$1,234.50', 'point') // { ok: true, value: 1234.5, ambiguous: false }
 * @example parseNumberCell('(12.00)', 'point') // { ok: true, value: -12, ambiguous: false }
 * @example parseNumberCell('1.234,5', 'auto') // { ok: true, value: 1234.5, ambiguous: false }
 */
export function parseNumberCell(raw: string, mark: DecimalMark): NumberCellResult {
  let start = 0;
  let end = raw.length;
  while (start < end && isSpace(raw.charCodeAt(start))) start++;
  while (end > start && isSpace(raw.charCodeAt(end - 1))) end--;
  const plain = plainNumber(raw, start, end, mark);
  if (plain !== null) return plain;

  let negative = false;
  let signs = 0;
  if (raw.charCodeAt(start) === C_LPAREN && raw.charCodeAt(end - 1) === C_RPAREN && end - start > 2) {
    negative = true;
    signs++;
    start++;
    end--;
  }
  // Prefix: signs, currency symbols and codes, spaces, in any order.
  while (start < end) {
    const c = raw.charCodeAt(start);
    if (isSpace(c) || isCurrencySymbol(c)) {
      start++;
    } else if (c === C_MINUS || c === C_UNICODE_MINUS || c === C_PLUS) {
      if (c !== C_PLUS) negative = !negative;
      signs++;
      start++;
    } else {
      const n = isLetterOrDollar(c) ? codeLengthAt(raw, start, end, false) : 0;
      if (n === 0) break;
      start += n;
    }
  }
  // Suffix: currency, a trailing minus (accounting style), spaces.
  while (end > start) {
    const c = raw.charCodeAt(end - 1);
    if (isSpace(c) || isCurrencySymbol(c)) {
      end--;
    } else if (c === C_MINUS) {
      negative = !negative;
      signs++;
      end--;
    } else {
      const n = isLetterOrDollar(c) ? codeLengthAt(raw, start, end, true) : 0;
      if (n === 0) break;
      end -= n;
    }
  }
  if (signs > 1 || start >= end) return { ok: false, why: NOT_A_NUMBER };

  let commas = 0;
  let dots = 0;
  let spaces = 0;
  let lastComma = -1;
  let lastDot = -1;
  let digits = 0;
  let exponentAt = -1;
  for (let i = start; i < end; i++) {
    const c = raw.charCodeAt(i);
    if (isDigit(c)) {
      digits++;
    } else if (c === C_COMMA) {
      commas++;
      lastComma = i;
    } else if (c === C_DOT) {
      dots++;
      lastDot = i;
    } else if (isSpace(c)) {
      spaces++;
    } else if ((c === 101 || c === 69) && exponentAt < 0 && digits > 0) {
      exponentAt = i;
    } else if (!((c === C_MINUS || c === C_PLUS) && exponentAt >= 0 && exponentAt === i - 1)) {
      return { ok: false, why: NOT_A_NUMBER };
    }
  }
  if (digits === 0) return { ok: false, why: NOT_A_NUMBER };
  if (exponentAt >= 0) return parseExponent(raw.slice(start, end), commas + spaces, negative);

  let decimal = -1; // char code of the decimal mark, -1 when none
  let group = -1;
  let ambiguous = false;
  if (mark === 'point') {
    decimal = C_DOT;
    group = C_COMMA;
  } else if (mark === 'comma') {
    decimal = C_COMMA;
    group = C_DOT;
  } else if (commas > 0 && dots > 0) {
    decimal = lastComma > lastDot ? C_COMMA : C_DOT;
    group = decimal === C_COMMA ? C_DOT : C_COMMA;
  } else if (commas + dots === 1) {
    decimal = commas === 1 ? C_COMMA : C_DOT;
    const at = commas === 1 ? lastComma : lastDot;
    const intLen = at - start;
    ambiguous = end - at - 1 === 3 && intLen >= 1 && intLen <= 3 && raw.charCodeAt(start) !== C_0;
  } else if (commas > 0) {
    group = C_COMMA;
  } else if (dots > 0) {
    group = C_DOT;
  }
  if (spaces > 0 && ((group === C_COMMA && commas > 0) || (group === C_DOT && dots > 0))) {
    return { ok: false, why: 'mixes spaces and marks as thousands separators' };
  }
  return assemble(raw, start, end, decimal, group, negative, ambiguous);
}

/** Checks the grouping (1-3 digits, then groups of exactly 3) and computes the value. */
function assemble(
  raw: string,
  start: number,
  end: number,
  decimal: number,
  group: number,
  negative: boolean,
  ambiguous: boolean,
): NumberCellResult {
  let segmentStart = start;
  let groups = 0;
  let decimalAt = -1;
  let digits = 0;
  let mantissa = 0;
  let fractionDigits = 0;
  for (let i = start; i <= end; i++) {
    const c = i < end ? raw.charCodeAt(i) : -2;
    if (i < end && isDigit(c)) {
      digits++;
      mantissa = mantissa * 10 + (c - C_0);
      if (decimalAt >= 0) fractionDigits++;
      continue;
    }
    const length = i - segmentStart;
    if (i < end && c === decimal) {
      if (decimalAt >= 0) return { ok: false, why: 'has two decimal marks' };
      if (groups > 0 && length !== 3) return { ok: false, why: WRONG_GROUPS };
      decimalAt = i;
    } else if (i < end && (c === group || isSpace(c))) {
      if (decimalAt >= 0) return { ok: false, why: 'has a thousands separator after the decimal mark' };
      if (groups === 0 ? length < 1 || length > 3 : length !== 3) return { ok: false, why: WRONG_GROUPS };
      groups++;
    } else if (i === end) {
      if (decimalAt < 0 && groups > 0 && length !== 3) return { ok: false, why: WRONG_GROUPS };
    } else {
      return { ok: false, why: NOT_A_NUMBER };
    }
    segmentStart = i + 1;
  }
  let value: number;
  if (digits <= MAX_EXACT_DIGITS && fractionDigits < POW10.length) {
    value = fractionDigits === 0 ? mantissa : mantissa / (POW10[fractionDigits] ?? 1);
  } else {
    let plain = '';
    for (let i = start; i < end; i++) {
      const c = raw.charCodeAt(i);
      if (isDigit(c)) plain += raw[i];
      else if (c === decimal) plain += '.';
    }
    value = Number(plain.startsWith('.') ? `0${plain}` : plain);
    if (!Number.isFinite(value)) return { ok: false, why: 'is too large' };
  }
  return { ok: true, value: negative && value !== 0 ? -value : value, ambiguous };
}

function parseExponent(body: string, separators: number, negative: boolean): NumberCellResult {
  if (separators > 0) return { ok: false, why: NOT_A_NUMBER };
  const value = Number(body);
  if (!Number.isFinite(value)) return { ok: false, why: NOT_A_NUMBER };
  return { ok: true, value: negative && value !== 0 ? -value : value, ambiguous: false };
}
