import Link from "next/link";
import { notFound } from "next/navigation";
import { UsersPanel } from "@/components/admin/users-panel";
import { PageHeader } from "@/components/ui/card";
import { buttonClass } from "@/components/ui/button";
import { listAllProjects } from "@/db/queries/users";
import { pageUser } from "@/lib/auth/page-access";

export const metadata = { title: "Admin" };

export default async function AdminPage() {
  const { user } = await pageUser();
  if (!user.isAdmin) notFound();
  const projects = await listAllProjects();
  return (
    <main className="mx-auto max-w-[1200px] px-6 py-8">
      <PageHeader
        title="Site admin"
        subtitle="Every user and their role in each project. Every change here is written to the audit trail."
        actions={
          <Link href="/admin/audit" className={buttonClass("secondary")}>
            Audit trail
          </Link>
        }
      />
      <UsersPanel projects={projects} selfId={user.id} />
    </main>
  );
}
