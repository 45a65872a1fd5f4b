"use client";

import useSWR from "swr";
import { Button, buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/card";
import { describe } from "@/lib/imports/describe";
import { call, fetcher, type ImportView } from "./api";

const live = (s: ImportView["status"]) => s === "pending" || s === "running";

/** Polls one import while it runs: progress, cancel, and the errors a person can act on. */
export function ImportStatus({ projectId, importId, onFinished }: { projectId: number; importId: string; onFinished?: (imp: ImportView) => void }) {
  const url = `/api/v1/projects/${projectId}/imports/${importId}`;
  const { data, mutate } = useSWR<{ import: ImportView }>(url, fetcher, {
    refreshInterval: (d) => (d && !live(d.import.status) ? 0 : 800),
    onSuccess: (d) => {
      if (!live(d.import.status)) onFinished?.(d.import);
    },
  });
  const imp = data?.import;
  if (!imp) return <p className="text-sm text-ink-soft">Loading the import…</p>;
  const pct = imp.rowsTotal ? Math.min(100, (imp.rowsDone / imp.rowsTotal) * 100) : imp.status === "succeeded" ? 100 : 0;
  return (
    <div className="space-y-4" aria-live="polite">
      <div>
        <div className="flex items-baseline justify-between text-sm">
          <span className="font-semibold text-ink" data-testid="import-status">
            {imp.status === "pending" ? "Waiting for a worker…" : imp.status === "running" ? (imp.cancelRequested ? "Stopping…" : "Importing…") : imp.status === "succeeded" ? "Imported" : imp.status === "cancelled" ? "Cancelled" : "Failed"}
          </span>
          <span className="text-xs text-ink-faint">
            {imp.rowsDone.toLocaleString("en")} {imp.rowsTotal && live(imp.status) ? `of ~${imp.rowsTotal.toLocaleString("en")} ` : ""}rows checked
          </span>
        </div>
        <div className="mt-1.5 h-2 overflow-hidden rounded-full bg-paper-sunk" role="progressbar" aria-label="Import progress" aria-valuenow={Math.round(pct)} aria-valuemin={0} aria-valuemax={100}>
          <div className={`h-full rounded-full transition-[width] ${imp.status === "failed" ? "bg-alarm-500" : "bg-pine-500"}`} style={{ width: `${pct}%` }} />
        </div>
      </div>
      {live(imp.status) ? (
        <Button variant="danger" size="sm" disabled={imp.cancelRequested} onClick={async () => mutate(await call<{ import: ImportView }>(`${url}/cancel`, { method: "POST" }))}>
          Cancel import
        </Button>
      ) : null}
      {imp.status === "succeeded" ? (
        <Notice tone="success" title={`${imp.itemsCreated.toLocaleString("en")} new items`}>
          {imp.itemsSkipped ? `${imp.itemsSkipped.toLocaleString("en")} were already in the project (same external id) and were left as they were.` : "Every row became an item."}
        </Notice>
      ) : null}
      {imp.status === "cancelled" ? <Notice tone="caution">{imp.message ?? "Cancelled; nothing was imported."}</Notice> : null}
      {imp.status === "failed" ? (
        <Notice tone="error" title={`Nothing was imported: ${imp.errorCount.toLocaleString("en")} problem${imp.errorCount === 1 ? "" : "s"}`}>
          <p>Fix the file and upload it again. {imp.errorCount > imp.errors.length ? `The first ${imp.errors.length} are listed; download the full list as CSV.` : ""}</p>
          <ul className="mt-2 max-h-72 list-disc space-y-1 overflow-y-auto pl-5 font-mono text-xs" data-testid="import-errors">
            {imp.errors.map((e, i) => (
              <li key={i}>{describe(e)}</li>
            ))}
          </ul>
          {imp.hasErrorReport ? (
            <a className={`${buttonClass("secondary", "sm")} mt-3`} href={`${url}/errors`}>
              Download all errors (CSV)
            </a>
          ) : null}
        </Notice>
      ) : null}
    </div>
  );
}
