/** Recognizes PostgreSQL errors by SQLSTATE, through Drizzle's wrapper, on PGlite and pg alike. */
function sqlState(e: unknown): string | undefined {
  let cur: unknown = e;
  for (let i = 0; i < 4 && cur; i++) {
    const code = (cur as { code?: unknown }).code;
    if (typeof code === 'string' && /^[0-9A-Z]{5}$/.test(code)) return code;
    cur = (cur as { cause?: unknown }).cause;
  }
  return undefined;
}

export const isUniqueViolation = (e: unknown) => sqlState(e) === '23505';
export const isExclusionViolation = (e: unknown) => sqlState(e) === '23P01';
export const isForeignKeyViolation = (e: unknown) => sqlState(e) === '23503';
export const isSerializationFailure = (e: unknown) => sqlState(e) === '40001' || sqlState(e) === '40P01';
