import { DrizzleAdapter } from "@auth/drizzle-adapter";
import { eq } from "drizzle-orm";
import NextAuth, { CredentialsSignin } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import Nodemailer from "next-auth/providers/nodemailer";
import { cache } from "react";
import { z } from "zod";
import { authConfig } from "@/auth.config";
import { db } from "@/db";
import { accounts, sessions, users, verificationTokens } from "@/db/schema";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { signInLinkMail } from "@/lib/mail/templates";
import { sendMail } from "@/lib/mail/mailer";
import { verifyPassword } from "@/lib/auth/password";
import { limitMailRequest, limitSignIn, resetSignInLimit } from "@/lib/auth/rate-limit";

declare module "next-auth" {
  interface Session {
    user: { id: string; name?: string | null; email?: string | null; image?: string | null };
  }
}

class RateLimited extends CredentialsSignin {
  code = "rate_limited";
}

const credentialsSchema = z.object({ email: z.string().trim().toLowerCase().email().max(320), password: z.string().min(1).max(200) });

/** The address our own proxy saw (X-Real-IP, or the last X-Forwarded-For hop it appended); earlier hops are the client's to forge. */
function clientAddress(request: Request): string {
  const real = request.headers.get("x-real-ip")?.trim();
  if (real) return real;
  const hops = request.headers.get("x-forwarded-for")?.split(",").map((h) => h.trim()).filter(Boolean) ?? [];
  return hops[hops.length - 1] || "local";
}

const nextAuth = NextAuth({
  ...authConfig,
  adapter: DrizzleAdapter(db, { usersTable: users, accountsTable: accounts, sessionsTable: sessions, verificationTokensTable: verificationTokens }),
  providers: [
    Credentials({
      credentials: { email: { type: "email" }, password: { type: "password" } },
      async authorize(raw, request) {
        const parsed = credentialsSchema.safeParse(raw);
        if (!parsed.success) return null;
        const { email, password } = parsed.data;
        try {
          await limitSignIn(email, clientAddress(request));
        } catch (error) {
          if (error instanceof AppError && error.kind === "rate_limited") throw new RateLimited();
          throw error;
        }
        const [user] = await db.select().from(users).where(eq(users.email, email)).limit(1);
        const ok = await verifyPassword(user?.passwordHash, password);
        if (!user || !ok || user.deactivatedAt) return null;
        await resetSignInLimit(email);
        return { id: user.id, email: user.email, name: user.name };
      },
    }),
    Nodemailer({
      server: { host: env.SMTP_HOST, port: env.SMTP_PORT, secure: env.SMTP_SECURE },
      from: env.MAIL_FROM,
      maxAge: 15 * 60,
      async sendVerificationRequest({ identifier, url }) {
        await limitMailRequest(identifier);
        const [user] = await db.select({ deactivatedAt: users.deactivatedAt }).from(users).where(eq(users.email, identifier.toLowerCase())).limit(1);
        // Only existing, active accounts get a link; the page answers the same either way.
        if (!user || user.deactivatedAt) return;
        await sendMail({ to: identifier, ...signInLinkMail(url) });
      },
    }),
  ],
  callbacks: {
    ...authConfig.callbacks,
    async signIn({ user, account }) {
      if (account?.provider === "nodemailer") {
        const email = (user.email ?? "").toLowerCase();
        const [row] = await db.select({ deactivatedAt: users.deactivatedAt }).from(users).where(eq(users.email, email)).limit(1);
        return Boolean(row && !row.deactivatedAt);
      }
      return true;
    },
  },
});

export const { handlers, signIn, signOut } = nextAuth;
/** Runs once per request (React cache). */
export const auth = cache(nextAuth.auth);
