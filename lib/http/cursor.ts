import { createHmac, timingSafeEqual } from "node:crypto";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";

/** Opaque, signed paging cursors: a tampered cursor is rejected, never reinterpreted. */
export function encodeCursor(scope: string, value: unknown): string {
  const body = Buffer.from(JSON.stringify(value)).toString("base64url");
  const mac = createHmac("sha256", env.AUTH_SECRET).update(`${scope}.${body}`).digest("base64url").slice(0, 22);
  return `${body}.${mac}`;
}

export function decodeCursor<T>(scope: string, cursor: string | null): T | null {
  if (!cursor) return null;
  const [body, mac] = cursor.split(".");
  if (!body || !mac) throw new AppError("bad_request:cursor", "The paging cursor is malformed.");
  const expected = createHmac("sha256", env.AUTH_SECRET).update(`${scope}.${body}`).digest("base64url").slice(0, 22);
  const a = Buffer.from(mac);
  const b = Buffer.from(expected);
  if (a.length !== b.length || !timingSafeEqual(a, b)) throw new AppError("bad_request:cursor", "The paging cursor is not valid here.");
  try {
    return JSON.parse(Buffer.from(body, "base64url").toString("utf8")) as T;
  } catch {
    throw new AppError("bad_request:cursor", "The paging cursor is malformed.");
  }
}
