"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import type { ProjectRole } from "@/db/schema";

type Entry = { href: string; label: string; needs: ProjectRole; group: "work" | "quality" | "data" | "setup" };

/** The project's screens, by the least role that opens each. */
export const projectScreens: Entry[] = [
  { href: "", label: "Overview", needs: "viewer", group: "work" },
  { href: "/desk", label: "Desk", needs: "annotator", group: "work" },
  { href: "/disputes", label: "Disputes", needs: "reviewer", group: "work" },
  { href: "/agreement", label: "Agreement", needs: "viewer", group: "quality" },
  { href: "/tuning", label: "Tuning", needs: "owner", group: "quality" },
  { href: "/doubts", label: "Doubts", needs: "owner", group: "quality" },
  { href: "/map", label: "Map", needs: "viewer", group: "quality" },
  { href: "/items", label: "Items", needs: "viewer", group: "data" },
  { href: "/import", label: "Import", needs: "owner", group: "data" },
  { href: "/editions", label: "Editions", needs: "viewer", group: "data" },
  { href: "/members", label: "Members", needs: "viewer", group: "setup" },
  { href: "/settings", label: "Settings", needs: "owner", group: "setup" },
  { href: "/audit", label: "Audit trail", needs: "owner", group: "setup" },
];

const rank: Record<ProjectRole, number> = { viewer: 0, annotator: 1, reviewer: 2, owner: 3 };
const groups = { work: "Work", quality: "Quality", data: "Data", setup: "Setup" } as const;

export function ProjectNav({ projectId, role }: { projectId: number; role: ProjectRole }) {
  const pathname = usePathname();
  const base = `/projects/${projectId}`;
  const visible = projectScreens.filter((s) => rank[role] >= rank[s.needs]);
  return (
    <nav aria-label="Project" className="space-y-5 text-sm">
      {(Object.keys(groups) as Array<keyof typeof groups>).map((g) => {
        const entries = visible.filter((s) => s.group === g);
        if (!entries.length) return null;
        return (
          <div key={g}>
            <p className="mb-1 px-3 text-[11px] font-bold uppercase tracking-[0.14em] text-ink-faint">{groups[g]}</p>
            <ul className="space-y-0.5">
              {entries.map((s) => {
                const href = `${base}${s.href}`;
                const active = s.href === "" ? pathname === base : pathname.startsWith(href);
                return (
                  <li key={s.href}>
                    <Link
                      href={href}
                      aria-current={active ? "page" : undefined}
                      className={`block rounded-md px-3 py-1.5 font-semibold ${active ? "bg-pine-600 text-white" : "text-ink-soft hover:bg-paper-sunk hover:text-ink"}`}
                    >
                      {s.label}
                    </Link>
                  </li>
                );
              })}
            </ul>
          </div>
        );
      })}
    </nav>
  );
}
