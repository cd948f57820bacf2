/**
 * Formula-injection neutralization for text cells of spreadsheet exports (CSV, XLSX).
 *
 * Source: OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection): no cell may
 * begin with `=`, `+`, `-`, `@`, tab (0x09), carriage return (0x0D) or line feed (0x0A); prefix
 * such a cell with a single quote so the spreadsheet reads it as text. OWASP ASVS 5.0 requirement
 * 1.2.10 adds NUL (0x00). Only text cells are touched: numbers are written as numbers, so a
 * negative number (a bill credit, a temperature) keeps its minus sign and stays a number.
 */

/** Characters that make a spreadsheet treat a cell as a formula (OWASP; NUL from ASVS 5.0). */
export const FORMULA_TRIGGERS: readonly string[] = ['=', '+', '-', '@', '\t', '\r', '\n', '\0'];

const TRIGGER_SET = new Set(FORMULA_TRIGGERS);

/** True when the text would start a formula in a spreadsheet. */
export function isFormulaLike(text: string): boolean {
  return text.length > 0 && TRIGGER_SET.has(text[0]!);
}

/**
 * The text with a leading single quote when it begins with a formula trigger; otherwise unchanged.
 * @example neutralizeText('=HYPERLINK("http://x")') // "'=HYPERLINK(\"http://x\")"
 * @example neutralizeText('-5') // "'-5" (text cell; a number -5 is never passed here)
 */
export function neutralizeText(text: string): string {
  return isFormulaLike(text) ? `'${text}` : text;
}
