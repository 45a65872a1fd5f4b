import { sql } from "drizzle-orm";
import Link from "next/link";
import { Card, Notice, PageHeader } from "@/components/ui/card";
import { db } from "@/db";
import { listClassesByProjectId } from "@/db/queries/projects";
import { pageRole } from "@/lib/auth/page-access";

const statusLabels: Record<string, string> = {
  unlabelled: "Unlabelled",
  in_progress: "In progress",
  agreed: "Agreed",
  disputed: "Disputed",
  ruled: "Ruled",
  control: "Control",
};

export default async function ProjectOverview({ params, searchParams }: { params: Promise<{ projectId: string }>; searchParams: Promise<{ denied?: string }> }) {
  const { projectId } = await params;
  const { denied } = await searchParams;
  const access = await pageRole(projectId, "viewer");
  const p = access.project;
  const counts = await db.execute<{ status: string; n: number }>(sql`select status, count(*)::int as n from items where project_id = ${p.id} group by status`);
  const classes = await listClassesByProjectId({ projectId: p.id });
  const total = counts.rows.reduce((s, r) => s + r.n, 0);
  const s = p.settings;
  return (
    <main>
      <PageHeader title={p.name} subtitle={p.description || "No description yet."} />
      {denied ? <Notice tone="caution">That screen needs the {denied} role in this project.</Notice> : null}
      <div className="mt-4 grid gap-6 xl:grid-cols-[2fr_1fr]">
        <Card title="Where the items stand">
          {total === 0 ? (
            <p className="text-sm text-ink-soft">
              No items yet.{" "}
              {access.role === "owner" || access.isAdmin ? (
                <Link className="font-semibold text-pine-700 underline" href={`/projects/${p.id}/import`}>
                  Import items
                </Link>
              ) : (
                "The owner has not imported any."
              )}
            </p>
          ) : (
            <dl className="grid grid-cols-2 gap-4 sm:grid-cols-3">
              {Object.keys(statusLabels).map((k) => {
                const n = counts.rows.find((r) => r.status === k)?.n ?? 0;
                return (
                  <div key={k} className="rounded-md border border-line bg-paper p-3">
                    <dt className="text-xs font-bold uppercase tracking-[0.1em] text-ink-faint">{statusLabels[k]}</dt>
                    <dd className="num mt-1 text-2xl font-bold text-ink">{n.toLocaleString("en")}</dd>
                    <dd className="text-xs text-ink-faint">{total ? ((100 * n) / total).toFixed(1) : "0"}%</dd>
                  </div>
                );
              })}
            </dl>
          )}
        </Card>
        <Card title="Setup">
          <dl className="space-y-2 text-sm">
            <div className="flex justify-between"><dt className="text-ink-soft">Overlap</dt><dd className="num font-semibold">{s.overlap} per item</dd></div>
            <div className="flex justify-between"><dt className="text-ink-soft">Blind share</dt><dd className="num font-semibold">{Math.round(s.blindShare * 100)}%</dd></div>
            <div className="flex justify-between"><dt className="text-ink-soft">Control items</dt><dd className="num font-semibold">{Math.round(s.controlRate * 100)}%</dd></div>
            <div className="flex justify-between"><dt className="text-ink-soft">Suggestions</dt><dd className="num font-semibold">k = {s.k}, {s.distance}</dd></div>
          </dl>
          <ul className="mt-4 flex flex-wrap gap-1.5">
            {classes.map((c) => (
              <li key={c.id} className="inline-flex items-center gap-1.5 rounded-full border border-line bg-paper px-2.5 py-0.5 text-xs font-semibold">
                <span className="h-2.5 w-2.5 rounded-full" style={{ background: c.colour }} aria-hidden="true" />
                {c.name}
                <kbd className="num text-ink-faint">{c.keyHint}</kbd>
              </li>
            ))}
          </ul>
        </Card>
      </div>
    </main>
  );
}
