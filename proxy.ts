import NextAuth from "next-auth";
import { NextResponse } from "next/server";
import { authConfig } from "@/auth.config";

const { auth } = NextAuth(authConfig);

const publicPrefixes = ["/sign-in", "/forgot-password", "/reset-password", "/invitations"];

/** Only redirects signed-out visitors; every handler checks the caller and its role again. */
export default auth((req) => {
  const { pathname, search } = req.nextUrl;
  if (req.auth || publicPrefixes.some((p) => pathname === p || pathname.startsWith(`${p}/`))) return NextResponse.next();
  const url = new URL("/sign-in", req.nextUrl.origin);
  if (pathname !== "/") url.searchParams.set("callbackUrl", `${pathname}${search}`);
  return NextResponse.redirect(url);
});

export const config = {
  matcher: ["/((?!api/|_next/static|_next/image|favicon.ico|fonts/).*)"],
};
