/**
 * Values as XML Schema lexical forms: xs:decimal never in exponent notation, xs:integer rounded,
 * text stripped of the characters XML 1.0 forbids (W3C XML 1.0 §2.2 Char production). Escaping of
 * `& < > " '` is left to the XML builder.
 */

// XML 1.0 §2.2: Char ::= #x9 | #xA | #xD | [#x20-#xD7FF] | [#xE000-#xFFFD] | [#x10000-#x10FFFF]
// eslint-disable-next-line no-control-regex
const NOT_XML_CHAR = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

/** Text safe for an XML 1.0 document (forbidden characters removed, trimmed). */
export function xmlText(text: string): string {
  return text.replace(NOT_XML_CHAR, '').trim();
}

/**
 * A finite number as an xs:decimal lexical form with at most `digits` decimals, no exponent and
 * no trailing zeros (W3C XML Schema 1.1 Part 2 §3.3.3: decimal has no exponent form).
 * @example xsDecimal(1e-7, 4) // '0'
 * @example xsDecimal(2.50, 2) // '2.5'
 */
export function xsDecimal(value: number, digits = 4): string {
  if (!Number.isFinite(value)) throw new Error(`not a finite number: ${value}`); // a caller's bug
  const fixed = value.toFixed(digits);
  const trimmed = fixed.includes('.') ? fixed.replace(/\.?0+$/, '') : fixed;
  return trimmed === '-0' ? '0' : trimmed;
}

/** A finite number rounded to an xs:integer lexical form. */
export function xsInteger(value: number): string {
  return xsDecimal(Math.round(value), 0);
}
