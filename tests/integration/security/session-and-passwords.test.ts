// Session cookie flags, sign-in rate limit per account and per address, and argon2id password hashes.
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { users } from "@/db/schema";
import { env } from "@/lib/env";
import { makeToken, makeUser, testPassword } from "@/tests/support/fixtures";
import { api, appUrl } from "@/tests/support/http";

/** One credentials sign-in through Auth.js, from a client address of the test's choosing. */
async function attempt(email: string, password: string, ip: string) {
  const csrfRes = await fetch(`${appUrl}/api/auth/csrf`);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const csrfCookie = csrfRes.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
  const res = await fetch(`${appUrl}/api/auth/callback/credentials`, {
    method: "POST",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: csrfCookie, "x-forwarded-for": ip },
    body: new URLSearchParams({ email, password, csrfToken, callbackUrl: appUrl }),
    redirect: "manual",
  });
  const setCookies = res.headers.getSetCookie();
  const session = setCookies.find((c) => /^(__Secure-)?authjs\.session-token=/.test(c));
  return { status: res.status, location: res.headers.get("location") ?? "", session };
}

const ip = () => `198.51.100.${Math.floor(Math.random() * 250) + 1}`;

describe("session cookie", () => {
  it("is HttpOnly, SameSite=Lax, Path=/ and (over plain http) not Secure", async () => {
    const u = await makeUser();
    const r = await attempt(u.email, testPassword, ip());
    expect(r.session, r.location).toBeDefined();
    const attrs = r.session!.split(";").map((s) => s.trim().toLowerCase());
    expect(attrs).toContain("httponly");
    expect(attrs).toContain("samesite=lax");
    expect(attrs).toContain("path=/");
    // Auth.js adds Secure and the __Secure- prefix only when AUTH_URL is https (docs/security.md).
    expect(attrs).not.toContain("secure");
    expect(r.session!.startsWith("authjs.session-token=")).toBe(true);
  });
});

describe("sign-in rate limit", () => {
  it(`blocks the account after ${env.SIGNIN_LIMIT_PER_ACCOUNT} failed attempts, even with the right password, and says why`, async () => {
    const u = await makeUser();
    for (let i = 0; i < env.SIGNIN_LIMIT_PER_ACCOUNT; i += 1) {
      const r = await attempt(u.email, "wrong-password-123", ip());
      expect(r.session).toBeUndefined();
      expect(r.location).toMatch(/error=CredentialsSignin/);
      expect(r.location).not.toMatch(/code=rate_limited/);
    }
    const blocked = await attempt(u.email, testPassword, ip());
    expect(blocked.session).toBeUndefined();
    expect(blocked.location).toMatch(/code=rate_limited/);
    const row = await pool.query("SELECT key FROM rate_limits WHERE key = $1", [`signin_account:${u.email.toLowerCase()}`]);
    expect(row.rowCount).toBe(1);
  });

  it("a correct sign-in before the limit resets the account's count", async () => {
    const u = await makeUser();
    for (let i = 0; i < env.SIGNIN_LIMIT_PER_ACCOUNT - 1; i += 1) await attempt(u.email, "wrong-password-123", ip());
    expect((await attempt(u.email, testPassword, ip())).session).toBeDefined();
    expect((await attempt(u.email, "wrong-password-123", ip())).location).not.toMatch(/code=rate_limited/);
    expect((await attempt(u.email, testPassword, ip())).session).toBeDefined();
  });

  it(`blocks one client address after ${env.SIGNIN_LIMIT_PER_IP} attempts across accounts`, async () => {
    const address = `203.0.113.${Math.floor(Math.random() * 250) + 1}`;
    const u = await makeUser();
    for (let i = 0; i < env.SIGNIN_LIMIT_PER_IP; i += 1) {
      const r = await attempt(`nobody-${i}-${Math.random().toString(36).slice(2, 6)}@example.test`, "wrong-password-123", address);
      expect(r.location, `attempt ${i + 1}`).not.toMatch(/code=rate_limited/);
    }
    const blocked = await attempt(u.email, testPassword, address);
    expect(blocked.session).toBeUndefined();
    expect(blocked.location).toMatch(/code=rate_limited/);
    expect((await attempt(u.email, testPassword, ip())).session).toBeDefined();
  }, 60_000);
});

describe("password hashes", () => {
  it("are argon2id with m = 19 MiB, t = 2, p = 1 in the users table, and never leave the server", async () => {
    const u = await makeUser({ isAdmin: true });
    const [row] = await db.select({ hash: users.passwordHash }).from(users).where(eq(users.id, u.id));
    // PHC string format; the OWASP Password Storage Cheat Sheet's argon2id minimum is m=19456 KiB, t=2, p=1 (recalled from memory).
    expect(row.hash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$[A-Za-z0-9+/]{22}\$[A-Za-z0-9+/]{43}$/);
    const all = await pool.query("SELECT count(*)::int AS n, count(*) FILTER (WHERE password_hash LIKE '$argon2id$%')::int AS argon FROM users WHERE password_hash IS NOT NULL");
    expect(all.rows[0].argon).toBe(all.rows[0].n);
    const token = (await makeToken(u.id)).secret;
    for (const path of ["/api/v1/me", "/api/v1/admin/users"]) {
      const res = await api(path, { token });
      expect(res.status, path).toBe(200);
      expect(res.text).not.toContain("$argon2");
      expect(res.text).not.toMatch(/passwordHash|password_hash/);
    }
  });
});
