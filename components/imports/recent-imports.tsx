"use client";

import useSWR from "swr";
import { groupDigits } from "@/lib/imports/describe";
import { fetcher, type ImportView } from "./api";

const tone: Record<ImportView["status"], string> = {
  pending: "text-ink-soft",
  running: "text-amber-700",
  succeeded: "text-pine-700",
  failed: "text-alarm-700",
  cancelled: "text-ink-faint",
};

/** The project's last imports, refreshed while any is running. */
export function RecentImports({ projectId }: { projectId: number }) {
  const { data } = useSWR<{ imports: ImportView[] }>(`/api/v1/projects/${projectId}/imports`, fetcher, {
    refreshInterval: (d) => (d?.imports.some((i) => i.status === "pending" || i.status === "running") ? 1500 : 10_000),
  });
  const rows = data?.imports ?? [];
  if (rows.length === 0) return <p className="text-sm text-ink-soft">No imports yet.</p>;
  return (
    <table className="w-full text-left text-sm">
      <thead className="text-xs uppercase tracking-wide text-ink-soft">
        <tr>
          <th className="py-1.5">When</th>
          <th>Format</th>
          <th>Status</th>
          <th className="text-right">New</th>
          <th className="text-right">Skipped</th>
          <th className="text-right">Problems</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.id} className="border-t border-line">
            <td className="py-1.5 text-ink-soft">{new Date(r.createdAt).toLocaleString("en-GB")}</td>
            <td>{r.format}</td>
            <td className={`font-semibold ${tone[r.status]}`}>{r.status}</td>
            <td className="text-right tabular-nums">{groupDigits(r.itemsCreated)}</td>
            <td className="text-right tabular-nums">{groupDigits(r.itemsSkipped)}</td>
            <td className="text-right tabular-nums">
              {r.hasErrorReport ? (
                <a className="text-pine-700 underline" href={`/api/v1/projects/${projectId}/imports/${r.id}/errors`}>
                  {groupDigits(r.errorCount)}
                </a>
              ) : (
                groupDigits(r.errorCount)
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
