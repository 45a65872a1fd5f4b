import Link from "next/link";
import { PageHeader } from "@/components/ui/card";
import { buttonClass } from "@/components/ui/button";
import { ItemsBrowser } from "@/components/items/items-browser";
import { listClassesByProjectId } from "@/db/queries/projects";
import { pageRole } from "@/lib/auth/page-access";

export const metadata = { title: "Items" };

export default async function ItemsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const access = await pageRole(projectId, "viewer");
  const classes = await listClassesByProjectId({ projectId: access.project.id });
  const canImport = access.isAdmin || access.role === "owner";
  return (
    <main className="max-w-[1200px]">
      <PageHeader
        title="Items"
        subtitle="Every item in the project. Filter by status, label, top vote share or id; click a row for its fields, image, labels and history."
        actions={canImport ? <Link className={buttonClass("secondary")} href={`/projects/${access.project.id}/import`}>Import items</Link> : null}
      />
      <ItemsBrowser projectId={access.project.id} classes={classes.map((c) => ({ id: c.id, name: c.name, colour: c.colour }))} />
    </main>
  );
}
