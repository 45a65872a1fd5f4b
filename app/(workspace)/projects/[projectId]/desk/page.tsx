import type { Metadata } from "next";
import { Desk } from "@/components/desk/desk";
import type { DeskColumn } from "@/components/desk/types";
import { listClassesByProjectId } from "@/db/queries/projects";
import { pageRole } from "@/lib/auth/page-access";

export const metadata: Metadata = { title: "Desk · Vicinal" };

export default async function DeskPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const access = await pageRole(projectId, "annotator");
  const classes = await listClassesByProjectId({ projectId: access.project.id });
  const columns: DeskColumn[] = (access.project.featureSchema?.columns ?? []).map((c) => ({ name: c.name, kind: c.kind, unit: c.unit }));
  return (
    <Desk
      projectId={access.project.id}
      projectName={access.project.name}
      classes={classes.map((c) => ({ id: c.id, name: c.name, colour: c.colour, keyHint: c.keyHint }))}
      columns={columns}
    />
  );
}
