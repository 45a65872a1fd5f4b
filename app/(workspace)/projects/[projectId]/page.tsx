import { Dashboard } from "@/components/dashboard/dashboard";
import { Card, Notice, PageHeader } from "@/components/ui/card";
import { listClassesByProjectId } from "@/db/queries/projects";
import { pageRole } from "@/lib/auth/page-access";
import { roleAtLeast } from "@/lib/auth/roles";

/** The project Overview is its dashboard: figures load on the client from …/dashboard; the setup card renders here. */
export default async function ProjectOverview({ params, searchParams }: { params: Promise<{ projectId: string }>; searchParams: Promise<{ denied?: string }> }) {
  const { projectId } = await params;
  const { denied } = await searchParams;
  const access = await pageRole(projectId, "viewer");
  const p = access.project;
  const classes = await listClassesByProjectId({ projectId: p.id });
  const role = access.isAdmin ? "owner" : access.role;
  const s = p.settings;
  const setup = (
    <Card title="Setup">
      <dl className="space-y-2 text-sm">
        <div className="flex justify-between"><dt className="text-ink-soft">Overlap</dt><dd className="num font-semibold">{s.overlap} per item</dd></div>
        <div className="flex justify-between"><dt className="text-ink-soft">Blind share</dt><dd className="num font-semibold">{Math.round(s.blindShare * 100)}%</dd></div>
        <div className="flex justify-between"><dt className="text-ink-soft">Control items</dt><dd className="num font-semibold">{Math.round(s.controlRate * 100)}%</dd></div>
        <div className="flex justify-between"><dt className="text-ink-soft">Suggestions</dt><dd className="num font-semibold">k = {s.k}, {s.distance}</dd></div>
      </dl>
      <ul className="mt-4 flex flex-wrap gap-1.5" aria-label="Label set">
        {classes.map((c) => (
          <li key={c.id} className="inline-flex items-center gap-1.5 rounded-full border border-line bg-paper px-2.5 py-0.5 text-xs font-semibold">
            <span className="h-2.5 w-2.5 rounded-full" style={{ background: c.colour }} aria-hidden="true" />
            {c.name}
            <kbd className="num text-ink-faint">{c.keyHint}</kbd>
          </li>
        ))}
      </ul>
    </Card>
  );
  return (
    <main>
      <PageHeader title={p.name} subtitle={p.description || "No description yet."} />
      {denied ? (
        <div className="mb-4">
          <Notice tone="caution">That screen needs the {denied} role in this project.</Notice>
        </div>
      ) : null}
      <Dashboard projectId={p.id} canImport={roleAtLeast(role, "owner")} canReview={roleAtLeast(role, "reviewer")} setup={setup} />
    </main>
  );
}
