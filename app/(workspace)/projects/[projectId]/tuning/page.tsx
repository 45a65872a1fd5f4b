import { PageHeader } from "@/components/ui/card";
import { TuningPanel } from "@/components/tuning/tuning-panel";
import { pageRole } from "@/lib/auth/page-access";

export const metadata = { title: "Tuning" };

export default async function TuningPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { project } = await pageRole(projectId, "owner");
  return (
    <main>
      <PageHeader title="Tuning" subtitle={`How well would the neighbours' vote have labelled what people labelled? Now: k = ${project.settings.k}, ${project.settings.distance}.`} />
      <TuningPanel projectId={project.id} />
    </main>
  );
}
