/** The PostgreSQL error code of an error thrown through pg or drizzle (which wraps it in `cause`). */
export function pgCode(error: unknown): string | undefined {
  let e: unknown = error;
  for (let depth = 0; e && depth < 4; depth += 1) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === "string" && /^[0-9A-Z]{5}$/.test(code)) return code;
    e = (e as { cause?: unknown }).cause;
  }
  return undefined;
}

export function pgConstraint(error: unknown): string | undefined {
  let e: unknown = error;
  for (let depth = 0; e && depth < 4; depth += 1) {
    const c = (e as { constraint?: unknown }).constraint;
    if (typeof c === "string") return c;
    e = (e as { cause?: unknown }).cause;
  }
  return undefined;
}

export const isUniqueViolation = (error: unknown) => pgCode(error) === "23505";
