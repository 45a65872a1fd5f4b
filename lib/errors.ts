/** One typed application error: `kind:subject` codes map to HTTP statuses. */
export type ErrorKind = "bad_request" | "unauthorized" | "forbidden" | "not_found" | "conflict" | "rate_limited" | "unavailable" | "too_large";

export const statusByKind: Record<ErrorKind, number> = {
  bad_request: 400,
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  too_large: 413,
  rate_limited: 429,
  unavailable: 503,
};

export class AppError extends Error {
  readonly kind: ErrorKind;
  readonly code: string;
  readonly status: number;
  readonly details?: unknown;

  constructor(code: `${ErrorKind}:${string}`, message: string, details?: unknown) {
    super(message);
    const kind = code.split(":")[0] as ErrorKind;
    this.kind = kind;
    this.code = code;
    this.status = statusByKind[kind];
    this.details = details;
  }
}

const connectionErrorCodes = new Set(["ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "57P01", "57P02", "57P03", "08000", "08003", "08006", "08001", "08004"]);

/** Errors from the object-store client (AWS SDK v3 marks them with $metadata or $fault). */
export function isStorageError(error: unknown): boolean {
  let e: unknown = error;
  for (let depth = 0; e && depth < 4; depth += 1) {
    const err = e as { $metadata?: unknown; $fault?: unknown; cause?: unknown };
    if (err.$metadata !== undefined || err.$fault !== undefined) return true;
    e = err.cause;
  }
  return false;
}

/** True when a thrown error means PostgreSQL is unreachable or restarting (not the object store's network errors). */
export function isDatabaseUnavailable(error: unknown): boolean {
  if (isStorageError(error)) return false;
  let e: unknown = error;
  for (let depth = 0; e && depth < 4; depth += 1) {
    const err = e as { code?: string; message?: string; cause?: unknown };
    if (err.code && connectionErrorCodes.has(err.code)) return true;
    if (err.message && /Connection terminated|Client has encountered a connection error|connect ECONNREFUSED|timeout exceeded when trying to connect|the database system is (starting up|shutting down|in recovery mode)|terminating connection|Client was closed and is not queryable|Cannot use a pool after calling end/i.test(err.message)) return true;
    e = err.cause;
  }
  return false;
}

/** True when the object store cannot be reached (as opposed to answering with an error). */
export function isStorageUnavailable(error: unknown): boolean {
  if (!isStorageError(error)) return false;
  const err = error as { code?: string; name?: string; message?: string; $metadata?: { httpStatusCode?: number } };
  if (err.$metadata?.httpStatusCode && err.$metadata.httpStatusCode >= 500) return true;
  return /ECONNREFUSED|ECONNRESET|ETIMEDOUT|EPIPE|socket hang up|TimeoutError|RequestTimeout|connect/i.test(`${err.code ?? ""} ${err.name ?? ""} ${err.message ?? ""}`);
}
