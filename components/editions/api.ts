import type { EditionDiff, DownloadLink } from "@/lib/editions/service";
import type { EditionDetail, EditionSummary } from "@/lib/editions/view";

export type { DownloadLink, EditionDetail, EditionDiff, EditionSummary };
export type EditionPage = { data: EditionSummary[]; nextCursor: string | null };

export const editionsUrl = (projectId: number) => `/api/v1/projects/${projectId}/editions`;
export const isBusy = (e: Pick<EditionSummary, "status">) => e.status === "pending" || e.status === "running";

export function formatBytes(n: number): string {
  if (n < 1024) return `${n} B`;
  const units = ["KB", "MB", "GB", "TB"];
  let v = n / 1024;
  let u = 0;
  while (v >= 1024 && u < units.length - 1) {
    v /= 1024;
    u += 1;
  }
  return `${v.toFixed(v < 10 ? 1 : 0)} ${units[u]}`;
}

export const when = (iso: string | null) => (iso ? new Date(iso).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" }) : "—");

export const sourceNames: Record<string, string> = { agreed: "Agreed", ruling: "Ruling", single: "Single label", control: "Control items", disputed: "Disputed" };

export const statusTone: Record<EditionSummary["status"], string> = {
  pending: "border-amber-500/40 bg-amber-50 text-amber-700",
  running: "border-amber-500/60 bg-amber-100 text-amber-700",
  succeeded: "border-pine-500/40 bg-pine-50 text-pine-700",
  failed: "border-alarm-500/40 bg-alarm-50 text-alarm-700",
  cancelled: "border-line bg-paper-sunk text-ink-faint",
};

export const statusWord: Record<EditionSummary["status"], string> = { pending: "queued", running: "freezing…", succeeded: "published", failed: "failed", cancelled: "cancelled" };
