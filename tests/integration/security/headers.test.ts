// Security headers on pages, redirects and the API, as the production build sends them.
import { beforeAll, describe, expect, it } from "vitest";
import { makeUser, testPassword } from "@/tests/support/fixtures";
import { appUrl, signInCookie } from "@/tests/support/http";

/** Splits a CSP header into directive → sources. */
function directives(csp: string) {
  return new Map(csp.split(";").map((d) => d.trim().split(/\s+/)).filter((p) => p[0]).map(([name, ...rest]) => [name, rest]));
}

async function get(path: string, cookie?: string) {
  return fetch(`${appUrl}${path}`, { headers: cookie ? { cookie } : {}, redirect: "manual" });
}

let cookie = "";
beforeAll(async () => {
  const u = await makeUser();
  cookie = await signInCookie(u.email, testPassword);
});

function expectPageCsp(res: Response, html?: string) {
  const csp = res.headers.get("content-security-policy") ?? "";
  const d = directives(csp);
  const script = d.get("script-src") ?? [];
  const nonce = script.find((s) => s.startsWith("'nonce-"));
  expect(nonce, csp).toMatch(/^'nonce-[A-Za-z0-9+/=]{16,}'$/);
  expect(script).toContain("'strict-dynamic'");
  expect(script).not.toContain("'unsafe-inline'");
  expect(script).not.toContain("'unsafe-eval'");
  expect(d.get("frame-ancestors")).toEqual(["'none'"]);
  expect(d.get("object-src")).toEqual(["'none'"]);
  expect(d.get("base-uri")).toEqual(["'self'"]);
  if (html) {
    // Every <script> Next emits carries this response's nonce; none is left without it.
    const value = nonce!.slice("'nonce-".length, -1);
    const tags = html.match(/<script\b[^>]*>/g) ?? [];
    expect(tags.length).toBeGreaterThan(0);
    for (const tag of tags) expect(tag, tag).toContain(`nonce="${value}"`);
  }
  return nonce!;
}

function expectCommon(res: Response) {
  expect(res.headers.get("x-content-type-options")).toBe("nosniff");
  expect(res.headers.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
  expect(res.headers.get("x-frame-options")).toBe("DENY");
  expect(res.headers.get("x-powered-by")).toBeNull();
}

describe("security headers", () => {
  it("the public sign-in page: nonce CSP with 'strict-dynamic', no inline scripts, no framing", async () => {
    const res = await get("/sign-in");
    expect(res.status).toBe(200);
    expectCommon(res);
    expectPageCsp(res, await res.text());
  });

  it("a signed-in page: the same, and a fresh nonce on every response", async () => {
    const a = await get("/projects", cookie);
    const b = await get("/projects", cookie);
    expect(a.status).toBe(200);
    expectCommon(a);
    const na = expectPageCsp(a, await a.text());
    const nb = expectPageCsp(b, await b.text());
    expect(na).not.toBe(nb);
  });

  it("the redirect of a signed-out visitor carries the headers too", async () => {
    const res = await get("/projects");
    expect([302, 303, 307, 308]).toContain(res.status);
    expect(res.headers.get("location")).toMatch(/\/sign-in/);
    expectCommon(res);
    expectPageCsp(res);
  });

  it("API answers: default-src 'none', frame-ancestors 'none', no-store, nosniff, JSON content type", async () => {
    for (const [path, withCookie] of [["/api/v1/me", true], ["/api/v1/me", false], ["/api/v1/projects/1 or 1=1", true]] as const) {
      const res = await get(path, withCookie ? cookie : undefined);
      expectCommon(res);
      const d = directives(res.headers.get("content-security-policy") ?? "");
      expect(d.get("default-src"), path).toEqual(["'none'"]);
      expect(d.get("frame-ancestors")).toEqual(["'none'"]);
      expect(res.headers.get("cache-control")).toMatch(/no-store/);
      expect(res.headers.get("content-type")).toMatch(/^application\/json/);
    }
  });
});
