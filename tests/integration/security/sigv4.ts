// An independent AWS Signature Version 4 check of presigned (query-string) URLs, written from AWS's published
// algorithm ("Authenticating Requests: Using Query Parameters (AWS Signature Version 4)", Amazon S3 API Reference).
// The local fake S3 server does not verify SigV4 signatures, so key and method binding is checked here instead.
import { createHash, createHmac } from "node:crypto";

const rfc3986 = (s: string) => encodeURIComponent(s).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
const hmac = (key: Buffer | string, data: string) => createHmac("sha256", key).update(data).digest();

/** The signature a URL should carry for this method, path and headers, given the secret key. */
export function sigv4Signature(url: URL, method: string, headers: Record<string, string>, secret: string): string {
  const q = [...url.searchParams.entries()].filter(([k]) => k !== "X-Amz-Signature").map(([k, v]) => `${rfc3986(k)}=${rfc3986(v)}`).sort().join("&");
  const signed = (url.searchParams.get("X-Amz-SignedHeaders") ?? "").split(";");
  const canonicalHeaders = signed.map((h) => `${h}:${(h === "host" ? url.host : headers[h] ?? "").trim()}\n`).join("");
  const canonical = [method, url.pathname, q, canonicalHeaders, signed.join(";"), "UNSIGNED-PAYLOAD"].join("\n");
  const [, date, region, service] = (url.searchParams.get("X-Amz-Credential") ?? "").split("/");
  const scope = `${date}/${region}/${service}/aws4_request`;
  const toSign = ["AWS4-HMAC-SHA256", url.searchParams.get("X-Amz-Date"), scope, createHash("sha256").update(canonical).digest("hex")].join("\n");
  const key = hmac(hmac(hmac(hmac(`AWS4${secret}`, date), region), service), "aws4_request");
  return createHmac("sha256", key).update(toSign).digest("hex");
}
