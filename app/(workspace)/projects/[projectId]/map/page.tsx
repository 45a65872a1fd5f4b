import { MapPanel } from "@/components/map/map-panel";
import { PageHeader } from "@/components/ui/card";
import { pageRole } from "@/lib/auth/page-access";

export const metadata = { title: "Map" };

export default async function MapPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { project } = await pageRole(projectId, "viewer");
  return (
    <main>
      <PageHeader title="Map" subtitle="The items in two dimensions, with the regions the neighbours' vote suggests. Slide k to see how it smooths the boundaries." />
      <MapPanel projectId={project.id} />
    </main>
  );
}
