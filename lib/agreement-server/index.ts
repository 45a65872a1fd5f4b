import "server-only";
import { listAgreementNamesByProjectId } from "@/db/queries/agreement";
import type { ProjectRole } from "@/db/schema";
import { getProjectAgreement, INLINE_LABEL_LIMIT } from "./cache";
import type { AgreementView } from "./types";
import { toAgreementView } from "./view";

export { INLINE_LABEL_LIMIT, getProjectAgreement, queueProjectAgreement, runQueuedAgreement } from "./cache";
export { AGREEMENT_OPTIONS, computeProjectAgreement, refreshProjectAgreement } from "./compute";
export { buildAgreementInputs } from "./input";
export { toAgreementView } from "./view";
export type * from "./types";

/** Owners, reviewers and site admins see who annotated; annotators and viewers see numbered annotators. */
export function namesVisibleTo(role: ProjectRole | null, isAdmin: boolean): boolean {
  return isAdmin || role === "owner" || role === "reviewer";
}

/** The agreement answer for one caller, as the API and the page show it. */
export async function getAgreementView({ projectId, userId, role, isAdmin, inlineLimit = INLINE_LABEL_LIMIT }: { projectId: number; userId: string; role: ProjectRole | null; isAdmin: boolean; inlineLimit?: number }): Promise<AgreementView> {
  const found = await getProjectAgreement({ projectId, inlineLimit });
  const namesVisible = namesVisibleTo(role, isAdmin);
  const names = await listAgreementNamesByProjectId({ projectId, userIds: namesVisible && found.stored ? found.stored.annotatorIds : [] });
  return toAgreementView(projectId, found, names, { userId, namesVisible });
}
