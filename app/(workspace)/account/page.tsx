import Link from "next/link";
import { TokensPanel } from "@/components/account/tokens-panel";
import { Card, PageHeader } from "@/components/ui/card";
import { pageUser } from "@/lib/auth/page-access";

export const metadata = { title: "Account" };

export default async function AccountPage() {
  const { user } = await pageUser();
  return (
    <main className="mx-auto max-w-[900px] space-y-6 px-6 py-8">
      <PageHeader title="Account" subtitle={`${user.name ?? ""} · ${user.email}`} />
      <Card title="Password">
        <p className="text-sm text-ink-soft">
          To change your password, request a reset link:{" "}
          <Link href="/forgot-password" className="font-semibold text-pine-700 underline">
            reset password
          </Link>
          .
        </p>
      </Card>
      <TokensPanel />
    </main>
  );
}
