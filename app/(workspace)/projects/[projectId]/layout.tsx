import Link from "next/link";
import { ProjectNav } from "@/components/workspace/project-nav";
import { pageRole } from "@/lib/auth/page-access";

export default async function ProjectLayout({ children, params }: { children: React.ReactNode; params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const access = await pageRole(projectId, "viewer");
  const role = access.role ?? "owner";
  return (
    <div className="mx-auto grid max-w-[1400px] gap-8 px-6 py-6 lg:grid-cols-[200px_1fr]">
      <aside className="min-w-0 space-y-4">
        <div>
          <Link href="/projects" className="text-xs font-semibold text-ink-faint hover:text-ink">
            ← All projects
          </Link>
          <p className="mt-2 break-words text-base font-extrabold leading-snug text-ink">{access.project.name}</p>
          <p className="text-xs text-ink-faint">
            You are <span className="font-semibold text-ink-soft">{access.role ?? "site admin"}</span>
          </p>
        </div>
        <ProjectNav projectId={access.project.id} role={role} />
      </aside>
      <div className="min-w-0">{children}</div>
    </div>
  );
}
