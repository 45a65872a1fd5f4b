import { PageHeader } from "@/components/ui/card";
import { SettingsForm } from "@/components/projects/settings-form";
import { pageRole } from "@/lib/auth/page-access";

export const metadata = { title: "Settings" };

export default async function SettingsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { project } = await pageRole(projectId, "owner");
  return (
    <main className="max-w-[900px]">
      <PageHeader title="Settings" subtitle="Changes to k, distance, scaling or weighting are audit-logged and refresh suggestions." />
      <SettingsForm projectId={project.id} initial={{ name: project.name, description: project.description, settings: project.settings }} />
    </main>
  );
}
