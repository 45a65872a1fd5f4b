import "server-only";
import { NextResponse } from "next/server";
import { ZodError, type z } from "zod";
import { AppError, isDatabaseUnavailable, isStorageUnavailable } from "@/lib/errors";

export type ErrorBody = { error: { code: string; message: string; fields?: Array<{ path: string; message: string }>; details?: unknown } };

export function errorResponse(error: unknown): NextResponse<ErrorBody> {
  if (error instanceof AppError) {
    const headers: Record<string, string> = {};
    const retry = (error.details as { retryAfter?: number } | undefined)?.retryAfter;
    if (retry) headers["Retry-After"] = String(retry);
    return NextResponse.json({ error: { code: error.code, message: error.message, details: error.details } }, { status: error.status, headers });
  }
  if (error instanceof ZodError) {
    const fields = error.issues.map((i) => ({ path: i.path.join(".") || "(body)", message: i.message }));
    const first = fields[0];
    return NextResponse.json(
      { error: { code: "bad_request:validation", message: first ? `${first.path}: ${first.message}` : "Invalid input.", fields } },
      { status: 422 },
    );
  }
  const pgCode = (error as { code?: string; cause?: { code?: string } })?.code ?? (error as { cause?: { code?: string } })?.cause?.code;
  if (pgCode === "22021" || pgCode === "22P05") {
    return NextResponse.json(
      { error: { code: "bad_request:nul_character", message: "Text may not contain a NUL character (byte 0); remove it and send again." } },
      { status: 400 },
    );
  }
  if (isDatabaseUnavailable(error)) {
    return NextResponse.json(
      { error: { code: "unavailable:database", message: "The database is unavailable; try again in a few seconds." } },
      { status: 503, headers: { "Retry-After": "2" } },
    );
  }
  if (isStorageUnavailable(error)) {
    return NextResponse.json(
      { error: { code: "unavailable:storage", message: "The object store is unreachable; try again in a few seconds." } },
      { status: 503, headers: { "Retry-After": "5" } },
    );
  }
  console.error("[api]", error);
  return NextResponse.json({ error: { code: "internal:error", message: "Something went wrong on the server." } }, { status: 500 });
}

type Ctx<P> = { params: Promise<P> };

/** Wraps a route handler: typed params, JSON errors with stable codes. */
export function route<P = Record<string, string>>(handler: (req: Request, ctx: { params: P }) => Promise<Response>) {
  return async (req: Request, ctx: Ctx<P>) => {
    try {
      const params = ctx?.params ? await ctx.params : ({} as P);
      return await handler(req, { params });
    } catch (error) {
      return errorResponse(error);
    }
  };
}

/** Parses a JSON body with a schema; malformed JSON is a 400. */
export async function readJson<S extends z.ZodType>(req: Request, schema: S, maxBytes = 1_000_000): Promise<z.infer<S>> {
  const text = await req.text();
  if (text.length > maxBytes) throw new AppError("too_large:body", `The request body is over ${maxBytes} bytes.`);
  let data: unknown;
  try {
    data = text.length ? JSON.parse(text) : {};
  } catch {
    throw new AppError("bad_request:json", "The request body is not valid JSON.");
  }
  return schema.parse(data);
}

export function parseId(value: string, what: string): number {
  const n = Number(value);
  if (!/^\d{1,10}$/.test(value) || !Number.isSafeInteger(n) || n <= 0 || n > 2_147_483_647) {
    throw new AppError(`not_found:${what}`, `No such ${what}.`);
  }
  return n;
}

export function searchParams(req: Request) {
  return new URL(req.url).searchParams;
}

export const json = NextResponse.json;
