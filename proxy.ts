import NextAuth from "next-auth";
import { type NextRequest, NextResponse } from "next/server";
import { authConfig } from "@/auth.config";
import { pageCsp } from "@/lib/http/csp";

const { auth } = NextAuth(authConfig);

const publicPrefixes = ["/sign-in", "/forgot-password", "/reset-password", "/invitations"];

function withCsp(req: NextRequest, redirectTo?: URL) {
  const nonce = Buffer.from(crypto.randomUUID()).toString("base64");
  const csp = pageCsp(nonce);
  const res = redirectTo
    ? NextResponse.redirect(redirectTo)
    : (() => {
        const headers = new Headers(req.headers);
        headers.set("x-nonce", nonce);
        headers.set("Content-Security-Policy", csp);
        return NextResponse.next({ request: { headers } });
      })();
  res.headers.set("Content-Security-Policy", csp);
  return res;
}

/** Only redirects signed-out visitors (and sets the page CSP); every handler checks the caller and its role again. */
export default auth((req) => {
  const { pathname, search } = req.nextUrl;
  if (req.auth || publicPrefixes.some((p) => pathname === p || pathname.startsWith(`${p}/`))) return withCsp(req);
  const url = new URL("/sign-in", req.nextUrl.origin);
  if (pathname !== "/") url.searchParams.set("callbackUrl", `${pathname}${search}`);
  return withCsp(req, url);
});

export const config = {
  matcher: ["/((?!api/|_next/static|_next/image|favicon.ico|fonts/).*)"],
};
