import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { EmptyState, PageHeader } from "@/components/ui/card";
import { listProjectsByUserId } from "@/db/queries/projects";
import { pageUser } from "@/lib/auth/page-access";

export const metadata = { title: "Projects" };

export default async function ProjectsPage() {
  const { user } = await pageUser();
  const projects = await listProjectsByUserId({ userId: user.id, isAdmin: user.isAdmin });
  return (
    <main className="mx-auto max-w-[1100px] px-6 py-8">
      <PageHeader
        title="Projects"
        subtitle={user.isAdmin ? "As a site admin you see every project." : "The projects you are a member of."}
        actions={
          <Link href="/projects/new" className={buttonClass("primary")}>
            New project
          </Link>
        }
      />
      {projects.length === 0 ? (
        <EmptyState
          title="No projects yet"
          action={
            <Link href="/projects/new" className={buttonClass("primary")}>
              Create your first project
            </Link>
          }
        >
          Create a project with its label set, then import the items to label. Or ask a project owner to invite you.
        </EmptyState>
      ) : (
        <ul className="grid gap-4 md:grid-cols-2">
          {projects.map((p) => {
            const pct = p.itemCount ? Math.round((100 * p.decidedCount) / p.itemCount) : 0;
            return (
              <li key={p.id}>
                <Link href={`/projects/${p.id}`} className="block rounded-card border border-line bg-paper-raised p-5 shadow-card transition hover:border-pine-500">
                  <div className="flex items-start justify-between gap-3">
                    <h2 className="text-lg font-extrabold leading-snug text-ink">{p.name}</h2>
                    <span className="rounded-full bg-paper-sunk px-2.5 py-0.5 text-xs font-bold text-ink-soft">{p.role ?? "admin"}</span>
                  </div>
                  {p.description ? <p className="mt-1 line-clamp-2 text-sm text-ink-soft">{p.description}</p> : null}
                  <div className="mt-4 h-1.5 overflow-hidden rounded-full bg-paper-sunk" aria-hidden="true">
                    <div className="h-full bg-pine-500" style={{ width: `${pct}%` }} />
                  </div>
                  <p className="mt-2 text-xs text-ink-faint">
                    <span className="num">{p.decidedCount.toLocaleString("en")}</span> of <span className="num">{p.itemCount.toLocaleString("en")}</span> items decided ·{" "}
                    <span className="num">{p.memberCount}</span> members
                  </p>
                </Link>
              </li>
            );
          })}
        </ul>
      )}
    </main>
  );
}
