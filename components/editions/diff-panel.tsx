"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Select } from "@/components/ui/field";
import { ApiError, apiFetch } from "@/lib/client/api";
import { type DownloadLink, type EditionDiff, type EditionSummary, editionsUrl } from "./api";

const changeTone = { added: "text-pine-700", removed: "text-alarm-700", relabelled: "text-amber-700" } as const;

/** Pick two published editions and see what changed between them. */
export function DiffPanel({ projectId, editions }: { projectId: number; editions: EditionSummary[] }) {
  const done = editions.filter((e) => e.status === "succeeded");
  const [toPick, setTo] = useState<number | null>(null);
  const [fromPick, setFrom] = useState<number | null>(null);
  const to = toPick ?? done[0]?.id ?? null;
  const from = fromPick ?? done[1]?.id ?? null;
  const [diff, setDiff] = useState<EditionDiff | null>(null);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  if (done.length < 2) return <p className="text-sm text-ink-soft">Publish a second edition to compare it with the first.</p>;
  const base = `${editionsUrl(projectId)}/${to}/diff?against=${from}`;

  async function compare() {
    setBusy(true);
    setError(null);
    try {
      setDiff((await apiFetch<{ data: EditionDiff }>(base)).data);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "The comparison failed.");
    } finally {
      setBusy(false);
    }
  }
  async function downloadList() {
    try {
      window.location.assign((await apiFetch<DownloadLink>(`${base}&format=csv`)).url);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "The list could not be made.");
    }
  }

  const pick = (value: number | null, set: (n: number) => void, label: string) => (
    <label className="text-xs font-semibold text-ink-soft">
      {label}
      <Select value={value ?? ""} onChange={(e) => { set(Number(e.target.value)); setDiff(null); }} aria-label={label}>
        {done.map((e) => (
          <option key={e.id} value={e.id}>Edition {e.number}</option>
        ))}
      </Select>
    </label>
  );

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end gap-3">
        {pick(from, setFrom, "From")}
        {pick(to, setTo, "To")}
        <Button onClick={() => void compare()} disabled={busy || from === to}>{busy ? "Comparing…" : "Compare"}</Button>
      </div>
      {error ? <p role="alert" className="text-sm text-alarm-700">{error}</p> : null}
      {diff ? (
        <div className="space-y-3">
          <div className="flex flex-wrap gap-3 text-sm" aria-label="Changes">
            {(["added", "removed", "relabelled"] as const).map((k) => (
              <span key={k} className="rounded-md border border-line bg-paper px-3 py-1.5">
                <span className={`text-lg font-extrabold tabular-nums ${changeTone[k]}`}>{diff.counts[k].toLocaleString("en")}</span> <span className="text-ink-soft">{k}</span>
              </span>
            ))}
            <span className="rounded-md border border-line bg-paper px-3 py-1.5 text-ink-soft">
              <span className="text-lg font-extrabold tabular-nums text-ink">{diff.counts.unchanged.toLocaleString("en")}</span> unchanged
            </span>
          </div>
          {diff.changes.length ? (
            <table className="w-full text-left text-sm">
              <thead className="text-xs uppercase tracking-wide text-ink-soft">
                <tr><th className="py-1.5">Item</th><th>Change</th><th>Edition {diff.from.number}</th><th>Edition {diff.to.number}</th></tr>
              </thead>
              <tbody>
                {diff.changes.map((c) => (
                  <tr key={c.externalId} className="border-t border-line">
                    <td className="py-1 font-mono text-xs">{c.externalId}</td>
                    <td className={`font-semibold ${changeTone[c.change]}`}>{c.change}</td>
                    <td>{c.before ? (c.before.label ?? "disputed") : "—"}</td>
                    <td>{c.after ? (c.after.label ?? "disputed") : "—"}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : (
            <p className="text-sm text-ink-soft">The two editions hold the same items with the same labels.</p>
          )}
          {diff.truncated ? <p className="text-xs text-ink-faint">Showing the first {diff.changes.length} changes; the CSV has them all.</p> : null}
          <Button variant="secondary" size="sm" onClick={() => void downloadList()}>Download the list of changes (CSV)</Button>
        </div>
      ) : null}
    </div>
  );
}
