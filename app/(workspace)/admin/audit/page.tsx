import { notFound } from "next/navigation";
import { AuditTable } from "@/components/admin/audit-table";
import { PageHeader } from "@/components/ui/card";
import { pageUser } from "@/lib/auth/page-access";

export const metadata = { title: "Audit trail" };

export default async function AdminAuditPage() {
  const { user } = await pageUser();
  if (!user.isAdmin) notFound();
  return (
    <main className="mx-auto max-w-[1200px] px-6 py-8">
      <PageHeader title="Audit trail" subtitle="Role changes, invitations, tokens, rulings, settings and editions across all projects." />
      <AuditTable endpoint="/api/v1/admin/audit" showProject showActorFilter />
    </main>
  );
}
