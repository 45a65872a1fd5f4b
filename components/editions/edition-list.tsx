"use client";

import { type EditionSummary, when } from "./api";
import { StatusChip } from "./status-chip";

/** The project's editions, newest first; a row opens its manifest. */
export function EditionList({ editions, selected, onSelect }: { editions: EditionSummary[]; selected: number | null; onSelect: (id: number) => void }) {
  return (
    <table className="w-full text-left text-sm">
      <thead className="text-xs uppercase tracking-wide text-ink-soft">
        <tr>
          <th className="py-1.5">Edition</th>
          <th>Status</th>
          <th className="text-right">Rows</th>
          <th className="pl-4">Published</th>
          <th>By</th>
        </tr>
      </thead>
      <tbody>
        {editions.map((e) => (
          <tr key={e.id} className={`border-t border-line ${selected === e.id ? "bg-pine-50" : ""}`}>
            <td className="py-1.5">
              <button type="button" onClick={() => onSelect(e.id)} className="font-bold text-pine-700 underline-offset-2 hover:underline" aria-current={selected === e.id ? "true" : undefined}>
                Edition {e.number}
              </button>
            </td>
            <td>
              <StatusChip status={e.status} />
            </td>
            <td className="text-right tabular-nums">{e.rows === null ? "—" : e.rows.toLocaleString("en")}</td>
            <td className="pl-4 text-ink-soft">{e.status === "succeeded" ? when(e.publishedAt) : e.status === "failed" ? <span className="text-alarm-700">{e.message ?? "failed"}</span> : "—"}</td>
            <td className="text-ink-soft">{e.createdBy?.name ?? "—"}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
