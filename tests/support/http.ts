// HTTP helpers against the real app server started by `npm test`.
export const appUrl = process.env.VICINAL_TEST_APP_URL ?? "http://localhost:3100";
export const mailUrl = process.env.MAIL_WEB_URL ?? "http://127.0.0.1:1090";

export async function api(path: string, opts: { token?: string; cookie?: string; method?: string; body?: unknown; raw?: BodyInit; headers?: Record<string, string> } = {}) {
  const headers: Record<string, string> = { ...opts.headers };
  if (opts.token) headers.authorization = `Bearer ${opts.token}`;
  if (opts.cookie) headers.cookie = opts.cookie;
  let body: BodyInit | undefined = opts.raw;
  if (opts.body !== undefined) {
    headers["content-type"] = "application/json";
    body = JSON.stringify(opts.body);
  }
  const res = await fetch(`${appUrl}${path}`, { method: opts.method ?? (body ? "POST" : "GET"), headers, body, redirect: "manual" });
  const text = await res.text();
  let json: any = null;
  try {
    json = text ? JSON.parse(text) : null;
  } catch {
    json = null;
  }
  return { status: res.status, json, text, headers: res.headers };
}

/** Signs in through Auth.js's credentials endpoint and returns the session cookie. */
export async function signInCookie(email: string, password: string): Promise<string> {
  const csrfRes = await fetch(`${appUrl}/api/auth/csrf`);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const csrfCookie = csrfRes.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
  const res = await fetch(`${appUrl}/api/auth/callback/credentials`, {
    method: "POST",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: csrfCookie },
    body: new URLSearchParams({ email, password, csrfToken, callbackUrl: appUrl }),
    redirect: "manual",
  });
  const cookies = res.headers.getSetCookie().map((c) => c.split(";")[0]);
  const session = cookies.find((c) => c.startsWith("authjs.session-token=") || c.startsWith("__Secure-authjs.session-token="));
  if (!session) throw new Error(`sign-in failed for ${email} (status ${res.status})`);
  return session;
}

type MailDevMessage = { id: string; subject: string; text: string; to: Array<{ address: string }>; date: string };

/** Waits for an e-mail to `to` whose subject matches, from the SMTP catcher's API. */
export async function waitForMail(to: string, subject: RegExp, timeoutMs = 20_000): Promise<MailDevMessage> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const res = await fetch(`${mailUrl}/api/email`);
    const list = (await res.json()) as MailDevMessage[];
    const hit = list.reverse().find((m) => m.to.some((t) => t.address.toLowerCase() === to.toLowerCase()) && subject.test(m.subject));
    if (hit) return hit;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`no e-mail to ${to} matching ${subject} within ${timeoutMs} ms`);
}

export function firstLink(text: string): string {
  const m = text.match(/https?:\/\/\S+/);
  if (!m) throw new Error("no link in e-mail");
  return m[0];
}
