import { EditionsBoard } from "@/components/editions/editions-board";
import { Notice, PageHeader } from "@/components/ui/card";
import { pageRole } from "@/lib/auth/page-access";

export const metadata = { title: "Editions" };

export default async function EditionsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const access = await pageRole(projectId, "viewer");
  const canPublish = access.isAdmin || access.role === "owner";
  return (
    <main className="max-w-[1100px] space-y-6">
      <PageHeader
        title="Editions"
        subtitle="Frozen, numbered copies of the labelled set as CSV, Parquet and JSON Lines, each with a manifest of counts, settings, agreement and file hashes. Editions never change once published."
      />
      <Notice tone="caution" title="Editions record who labelled what">
        Every row names the annotators who labelled the item (by user id unless the owner chooses e-mail addresses) and carries the item&apos;s own fields, which may be personal
        data. Hand editions only to people entitled to them, and keep them under the same data-protection duties as the project.
      </Notice>
      <EditionsBoard projectId={access.project.id} canPublish={canPublish} />
    </main>
  );
}
