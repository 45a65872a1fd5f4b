import "server-only";
import { notFound, redirect } from "next/navigation";
import type { ProjectRole } from "@/db/schema";
import { type ProjectAccess, getCaller, requireRole } from "@/lib/auth/authorize";
import { AppError } from "@/lib/errors";

/** For server components: the same role gate as the API, answered as a redirect or a 404 page. */
export async function pageRole(projectIdParam: string, needed: ProjectRole): Promise<ProjectAccess> {
  const id = Number(projectIdParam);
  if (!/^\d{1,10}$/.test(projectIdParam)) notFound();
  try {
    return await requireRole(id, needed);
  } catch (error) {
    if (error instanceof AppError) {
      if (error.kind === "unauthorized") redirect(`/sign-in?callbackUrl=/projects/${id}`);
      if (error.kind === "forbidden") redirect(`/projects/${id}?denied=${needed}`);
      notFound();
    }
    throw error;
  }
}

export async function pageUser() {
  const caller = await getCaller();
  if (!caller) redirect("/sign-in");
  return caller;
}
