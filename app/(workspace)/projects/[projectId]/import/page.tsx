import { Card, Notice, PageHeader } from "@/components/ui/card";
import { ImportWizard } from "@/components/imports/import-wizard";
import { RecentImports } from "@/components/imports/recent-imports";
import { pageRole } from "@/lib/auth/page-access";
import { formatBytes } from "@/lib/imports/format-bytes";
import { limits } from "@/lib/imports/limits";

export const metadata = { title: "Import items" };

export default async function ImportPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const access = await pageRole(projectId, "owner");
  const missing = access.project.settings.missingValues;
  return (
    <main className="max-w-[1100px] space-y-6">
      <PageHeader
        title="Import items"
        subtitle={`Files go straight from your browser to the project's storage (up to ${formatBytes(limits.uploadMaxBytes)} each). Nothing is stored as items until every row checks out.`}
      />
      <Notice tone="caution" title="Items may hold personal data">
        Tables and images often describe or show people. Import only data you have the right to process for labelling: a lawful basis such as consent, a clear purpose,
        and only the fields the work needs. You remain responsible for the data-protection duties that come with it (information, access and erasure requests, retention).
        Editions record who labelled what.
      </Notice>
      <ImportWizard projectId={access.project.id} />
      <p className="text-xs text-ink-faint">
        Missing numbers (empty, NaN, Infinity) are {missing === "reject" ? "rejected" : "kept as missing"} in this project; change that under Settings. Re-importing rows whose id is already in
        the project leaves those items as they are.
      </p>
      <Card title="Recent imports">
        <RecentImports projectId={access.project.id} />
      </Card>
    </main>
  );
}
