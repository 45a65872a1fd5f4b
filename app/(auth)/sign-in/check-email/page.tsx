import Link from "next/link";

export const metadata = { title: "Check your e-mail" };

export default function CheckEmailPage() {
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-extrabold tracking-tight">Check your e-mail</h1>
      <p className="text-sm text-ink-soft">
        If an active account uses that address, a sign-in link is on its way. It works once, within 15 minutes. You can close this tab.
      </p>
      <Link href="/sign-in" className="text-sm font-semibold text-pine-700 hover:underline">
        Back to sign-in
      </Link>
    </div>
  );
}
