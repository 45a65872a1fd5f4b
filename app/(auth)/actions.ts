"use server";

import { AuthError } from "next-auth";
import { redirect } from "next/navigation";
import { z } from "zod";
import { auth, signIn, signOut } from "@/auth";
import { acceptInvitation } from "@/db/queries/members";
import { requestPasswordReset, resetPassword } from "@/db/queries/users";
import { passwordRules } from "@/lib/auth/password";
import { validatedAction } from "@/lib/http/action";

const email = z.string().trim().toLowerCase().email("Enter a valid e-mail address.").max(320);
const newPassword = z.string().min(passwordRules.min, `Use at least ${passwordRules.min} characters.`).max(passwordRules.max);
const safeCallback = z
  .string()
  .optional()
  .transform((v) => (v && v.startsWith("/") && !v.startsWith("//") ? v : "/projects"));

export const signInWithPassword = validatedAction(
  z.object({ email, password: z.string().min(1, "Enter your password.").max(200), callbackUrl: safeCallback }),
  async ({ email, password, callbackUrl }) => {
    try {
      await signIn("credentials", { email, password, redirectTo: callbackUrl });
    } catch (error) {
      if (error instanceof AuthError) {
        const code = (error as AuthError & { code?: string }).code;
        if (code === "rate_limited") return { error: "Too many sign-in attempts. Wait 15 minutes or use an e-mail link." };
        return { error: "That e-mail and password do not match an active account." };
      }
      throw error;
    }
  },
);

export const signInWithLink = validatedAction(z.object({ email, callbackUrl: safeCallback }), async ({ email, callbackUrl }) => {
  try {
    await signIn("nodemailer", { email, redirectTo: callbackUrl, redirect: false });
  } catch (error) {
    if (error instanceof AuthError) return { error: "The sign-in link could not be sent. Try again in a moment." };
    throw error;
  }
  redirect("/sign-in/check-email");
});

export const requestReset = validatedAction(z.object({ email }), async ({ email }) => {
  await requestPasswordReset({ email });
  return { ok: "If an account uses that address, a reset link is on its way. It works for 30 minutes." };
});

export const completeReset = validatedAction(
  z.object({ token: z.string().min(10).max(200), password: newPassword, confirm: z.string() }).refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords differ." }),
  async ({ token, password }) => {
    const user = await resetPassword({ secret: token, password });
    await signIn("credentials", { email: user.email, password, redirectTo: "/projects" });
  },
);

export const acceptInvite = validatedAction(
  z.object({ token: z.string().min(10).max(200), name: z.string().trim().max(120).optional(), password: z.string().max(200).optional() }),
  async ({ token, name, password }) => {
    const session = await auth();
    if (password !== undefined && password !== "" && password.length < passwordRules.min) {
      return { error: "Please correct the marked fields.", fieldErrors: { password: `Use at least ${passwordRules.min} characters.` } };
    }
    const result = await acceptInvitation({ secret: token, name: name || undefined, password: password || undefined, signedInUserId: session?.user?.id ?? null });
    if (session?.user?.id) redirect(`/projects/${result.projectId}`);
    if (password) await signIn("credentials", { email: result.email, password, redirectTo: `/projects/${result.projectId}` });
    redirect(`/sign-in?callbackUrl=/projects/${result.projectId}&joined=1`);
  },
);

export async function signOutAction() {
  await signOut({ redirectTo: "/sign-in" });
}
