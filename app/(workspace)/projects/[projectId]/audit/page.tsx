import { AuditTable } from "@/components/admin/audit-table";
import { PageHeader } from "@/components/ui/card";
import { pageRole } from "@/lib/auth/page-access";

export const metadata = { title: "Audit trail" };

export default async function ProjectAuditPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { project } = await pageRole(projectId, "owner");
  return (
    <main>
      <PageHeader title="Audit trail" subtitle="Who changed what in this project, and when." />
      <AuditTable endpoint={`/api/v1/projects/${project.id}/audit`} showProject={false} showActorFilter={false} />
    </main>
  );
}
