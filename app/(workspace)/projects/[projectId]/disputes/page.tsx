import type { Metadata } from "next";
import { DisputesBoard } from "@/components/disputes/disputes-board";
import type { DeskColumn } from "@/components/desk/types";
import { PageHeader } from "@/components/ui/card";
import { listClassesByProjectId } from "@/db/queries/projects";
import { pageRole } from "@/lib/auth/page-access";

export const metadata: Metadata = { title: "Disputes · Vicinal" };

export default async function DisputesPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const access = await pageRole(projectId, "reviewer");
  const classes = await listClassesByProjectId({ projectId: access.project.id });
  const columns: DeskColumn[] = (access.project.featureSchema?.columns ?? []).map((c) => ({ name: c.name, kind: c.kind, unit: c.unit }));
  return (
    <main>
      <PageHeader title="Disputes" subtitle="Items where annotators disagree, and labels the owner doubts. Your Ruling becomes the final label; give the reason." />
      <DisputesBoard projectId={access.project.id} classes={classes.map((c) => ({ id: c.id, name: c.name, colour: c.colour, keyHint: c.keyHint }))} columns={columns} />
    </main>
  );
}
