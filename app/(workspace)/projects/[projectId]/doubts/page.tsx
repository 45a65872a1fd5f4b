import { DoubtsPanel } from "@/components/doubts/doubts-panel";
import { PageHeader } from "@/components/ui/card";
import { pageRole } from "@/lib/auth/page-access";

export const metadata = { title: "Doubts" };

export default async function DoubtsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { project } = await pageRole(projectId, "owner");
  return (
    <main>
      <PageHeader title="Doubts" subtitle="Labelled items whose own label gets a low vote share among their nearest labelled neighbours, lowest first." />
      <DoubtsPanel projectId={project.id} />
    </main>
  );
}
