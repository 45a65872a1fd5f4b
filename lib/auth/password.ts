import { hash, verify } from "@node-rs/argon2";

// argon2id with the library's defaults (m = 19 MiB, t = 2, p = 1: the OWASP-recommended minimum).
export function hashPassword(password: string) {
  return hash(password);
}

let dummyHash: Promise<string> | undefined;

/** Verifies in constant work whether or not the user exists: an unknown e-mail still pays for one argon2 verify. */
export async function verifyPassword(storedHash: string | null | undefined, password: string): Promise<boolean> {
  if (!storedHash) {
    dummyHash ??= hash("vicinal-dummy-password-for-timing");
    await verify(await dummyHash, password).catch(() => false);
    return false;
  }
  return verify(storedHash, password).catch(() => false);
}

export const passwordRules = { min: 10, max: 200 } as const;
