import type { ProjectRole } from "@/db/schema";

export const projectRoles = ["owner", "reviewer", "annotator", "viewer"] as const satisfies readonly ProjectRole[];

/** Roles nest: an owner may do what a reviewer may, a reviewer what an annotator may, an annotator what a viewer may. */
const rank: Record<ProjectRole, number> = { viewer: 0, annotator: 1, reviewer: 2, owner: 3 };

export function roleAtLeast(role: ProjectRole | null | undefined, needed: ProjectRole): boolean {
  return role != null && rank[role] >= rank[needed];
}

export const roleDescriptions: Record<ProjectRole, string> = {
  owner: "Sets up the project, imports items, tunes suggestions, publishes editions",
  reviewer: "Works Disputes and issues rulings; can also label",
  annotator: "Labels items at the Desk",
  viewer: "Reads dashboards and editions",
};
