import { env } from "@/lib/env";

/**
 * The page Content-Security-Policy: scripts only with this request's nonce (Next adds it to its own
 * scripts) and what those load ('strict-dynamic'); no inline scripts, no framing. Inline style
 * attributes stay allowed: React sets element styles (bar widths, label colours) through them.
 */
export function pageCsp(nonce: string): string {
  const storage = env.S3_PUBLIC_ENDPOINT ?? env.S3_ENDPOINT;
  const storageOrigin = storage ? new URL(storage).origin : "";
  const dev = env.NODE_ENV === "development" ? " 'unsafe-eval'" : "";
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev}`,
    "style-src 'self' 'unsafe-inline'",
    `img-src 'self' data: blob: ${storageOrigin}`.trim(),
    "font-src 'self'",
    `connect-src 'self' ${storageOrigin}`.trim(),
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}
