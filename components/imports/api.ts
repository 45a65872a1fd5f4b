import type { ImportView } from "@/db/queries/imports";
import type { Preview } from "@/lib/imports/preview";

export type { ImportView, Preview };

export class ApiError extends Error {
  constructor(message: string, readonly status: number, readonly details?: unknown) {
    super(message);
  }
}

/** JSON fetch against the REST routes; error bodies become ApiError with the server's message. */
export async function call<T>(url: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const { json, ...rest } = init;
  const res = await fetch(url, { ...rest, method: rest.method ?? (json !== undefined ? "POST" : "GET"), headers: json !== undefined ? { "content-type": "application/json" } : undefined, body: json !== undefined ? JSON.stringify(json) : rest.body });
  const body = await res.json().catch(() => null);
  if (!res.ok) throw new ApiError(body?.error?.message ?? `Request failed (${res.status}).`, res.status, body?.error?.details);
  return body as T;
}

export const fetcher = <T,>(url: string) => call<T>(url);
