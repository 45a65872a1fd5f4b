import { redirect } from "next/navigation";
import { auth } from "@/auth";
import { SignInForms } from "@/components/auth/sign-in-forms";
import { Notice } from "@/components/ui/card";

export const metadata = { title: "Sign in" };

const authErrors: Record<string, string> = {
  CredentialsSignin: "That e-mail and password do not match an active account.",
  Verification: "That sign-in link has expired or was already used. Ask for a new one.",
  AccessDenied: "This account cannot sign in. It may be deactivated.",
};

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string; error?: string; joined?: string; reset?: string }> }) {
  const sp = await searchParams;
  const session = await auth();
  if (session?.user) redirect(sp.callbackUrl?.startsWith("/") ? sp.callbackUrl : "/projects");
  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-2xl font-extrabold tracking-tight">Sign in</h1>
        <p className="mt-1 text-sm text-ink-soft">Welcome back. Your projects are waiting.</p>
      </div>
      {sp.joined ? <Notice tone="success">You joined the project. Sign in to open it.</Notice> : null}
      <SignInForms callbackUrl={sp.callbackUrl} initialError={sp.error ? authErrors[sp.error] ?? "Sign-in failed. Try again." : undefined} />
    </div>
  );
}
