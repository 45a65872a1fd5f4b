import Link from "next/link";
import { RequestResetForm } from "@/components/auth/reset-forms";

export const metadata = { title: "Reset password" };

export default function ForgotPasswordPage() {
  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-2xl font-extrabold tracking-tight">Reset your password</h1>
        <p className="mt-1 text-sm text-ink-soft">Enter the e-mail of your account and we send a link to choose a new password.</p>
      </div>
      <RequestResetForm />
      <Link href="/sign-in" className="block text-center text-sm font-semibold text-pine-700 hover:underline">
        Back to sign-in
      </Link>
    </div>
  );
}
