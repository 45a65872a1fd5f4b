import { createHash, randomBytes, timingSafeEqual } from "node:crypto";

/** A random secret for links and API tokens; only its SHA-256 is stored. */
export function newSecret(prefix = ""): string {
  return prefix + randomBytes(24).toString("base64url");
}

export function hashSecret(secret: string): string {
  return createHash("sha256").update(secret).digest("hex");
}

export function sameHash(a: string, b: string): boolean {
  const x = Buffer.from(a, "hex");
  const y = Buffer.from(b, "hex");
  return x.length === y.length && timingSafeEqual(x, y);
}

export const apiTokenPrefix = "vcn_";
