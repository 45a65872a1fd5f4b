"use client";

import { useEffect } from "react";
import useSWR from "swr";
import { Button } from "@/components/ui/button";
import { fetcher } from "@/components/imports/api";
import type { ClassInfo, ItemRow } from "./types";

type Detail = {
  item: Pick<ItemRow, "id" | "externalId" | "status" | "isControl" | "labelCount" | "finalClassId" | "priorClassId" | "poolTopShare" | "fields"> & {
    finalSource: string | null;
    createdAt: string;
    features: Array<{ name: string; kind: string; value: number | null; values?: Array<number | null>; width?: number }>;
    imageUrl: string | null;
  };
  labels: Array<{ id: number; className: string; colour: string; annotator: string; tookSuggestion: boolean; suggestionShown: boolean; createdAt: string; undoneAt: string | null }>;
  disputes: Array<{ id: number; reason: string; status: string; note: string | null; openedAt: string; closedAt: string | null; rulingClassId: number | null; rulingReason: string | null; reviewer: string | null }>;
};

const when = (s: string) => new Date(s).toLocaleString("en-GB");
const num = (v: number | null) => (v === null ? "missing" : Number.isInteger(v) ? String(v) : v.toPrecision(6).replace(/\.?0+$/, ""));

/** Everything about one item: image, fields, features, labels and disputes, newest last. */
export function ItemDrawer({ projectId, itemId, classes, onClose }: { projectId: number; itemId: number; classes: ClassInfo[]; onClose: () => void }) {
  const { data, error } = useSWR<Detail>(`/api/v1/projects/${projectId}/items/${itemId}`, fetcher);
  useEffect(() => {
    const key = (e: KeyboardEvent) => e.key === "Escape" && onClose();
    window.addEventListener("keydown", key);
    return () => window.removeEventListener("keydown", key);
  }, [onClose]);
  const cls = (id: number | null) => classes.find((c) => c.id === id)?.name ?? "—";
  const it = data?.item;
  return (
    <div className="fixed inset-0 z-40 flex justify-end bg-ink/20" onClick={onClose}>
      <aside role="dialog" aria-modal="true" aria-label={`Item ${it?.externalId ?? itemId}`} className="h-full w-full max-w-lg overflow-y-auto border-l border-line bg-paper-raised p-6 shadow-card" onClick={(e) => e.stopPropagation()}>
        <div className="flex items-start justify-between gap-4">
          <div>
            <p className="text-xs font-bold uppercase tracking-wide text-ink-faint">Item</p>
            <h2 className="break-all font-mono text-lg font-bold text-ink">{it?.externalId ?? "…"}</h2>
          </div>
          <Button variant="quiet" size="sm" onClick={onClose}>
            Close
          </Button>
        </div>
        {error ? <p className="mt-4 text-sm text-alarm-700">{(error as Error).message}</p> : null}
        {it ? (
          <div className="mt-5 space-y-6 text-sm">
            {it.imageUrl ? <img src={it.imageUrl} alt={`Image of ${it.externalId}`} className="h-56 w-full rounded-md border border-line bg-paper-sunk object-contain [image-rendering:pixelated]" /> : null}
            <dl className="grid grid-cols-[8rem_1fr] gap-x-3 gap-y-1">
              <dt className="text-ink-faint">Status</dt>
              <dd>{it.isControl ? "control item" : it.status.replace("_", " ")}</dd>
              <dt className="text-ink-faint">Final label</dt>
              <dd>{cls(it.finalClassId)}{it.finalSource ? ` (${it.finalSource})` : ""}</dd>
              <dt className="text-ink-faint">Prior label</dt>
              <dd>{cls(it.priorClassId)}</dd>
              <dt className="text-ink-faint">Top vote share</dt>
              <dd>{it.poolTopShare === null ? "—" : `${Math.round(it.poolTopShare * 100)}%`}</dd>
              <dt className="text-ink-faint">Imported</dt>
              <dd>{when(it.createdAt)}</dd>
            </dl>
            {Object.keys(it.fields).length ? (
              <section>
                <h3 className="mb-1 text-xs font-bold uppercase tracking-wide text-ink-soft">Fields</h3>
                <dl className="grid grid-cols-[8rem_1fr] gap-x-3 gap-y-1">
                  {Object.entries(it.fields).map(([k, v]) => (
                    <div key={k} className="contents">
                      <dt className="truncate font-mono text-xs text-ink-faint">{k}</dt>
                      <dd className="whitespace-pre-wrap break-words">{v === null ? "—" : typeof v === "string" ? v : JSON.stringify(v)}</dd>
                    </div>
                  ))}
                </dl>
              </section>
            ) : null}
            {it.features.length ? (
              <section>
                <h3 className="mb-1 text-xs font-bold uppercase tracking-wide text-ink-soft">Features</h3>
                <dl className="grid grid-cols-[8rem_1fr] gap-x-3 gap-y-1 font-mono text-xs">
                  {it.features.map((f) => (
                    <div key={f.name} className="contents">
                      <dt className="truncate text-ink-faint">{f.name}</dt>
                      <dd className="break-words">{f.kind === "vector" ? `[${(f.values ?? []).map(num).join(", ")}${(f.width ?? 0) > (f.values?.length ?? 0) ? `, … ${f.width} in all` : ""}]` : num(f.value)}</dd>
                    </div>
                  ))}
                </dl>
              </section>
            ) : null}
            <section>
              <h3 className="mb-1 text-xs font-bold uppercase tracking-wide text-ink-soft">Labels ({data.labels.length})</h3>
              {data.labels.length === 0 ? <p className="text-ink-faint">No labels yet.</p> : null}
              <ol className="space-y-1">
                {data.labels.map((l) => (
                  <li key={l.id} className={l.undoneAt ? "text-ink-faint line-through" : ""}>
                    <span className="mr-1.5 inline-block h-2.5 w-2.5 rounded-full" style={{ background: l.colour }} />
                    <strong>{l.className}</strong> by {l.annotator} · {when(l.createdAt)}
                    {l.suggestionShown ? (l.tookSuggestion ? " · took the suggestion" : " · overrode the suggestion") : " · no suggestion shown"}
                    {l.undoneAt ? ` · undone ${when(l.undoneAt)}` : ""}
                  </li>
                ))}
              </ol>
            </section>
            <section>
              <h3 className="mb-1 text-xs font-bold uppercase tracking-wide text-ink-soft">History of disputes</h3>
              {data.disputes.length === 0 ? <p className="text-ink-faint">None.</p> : null}
              <ol className="space-y-2">
                {data.disputes.map((d) => (
                  <li key={d.id}>
                    {d.reason === "doubt" ? "Doubted" : "Disagreement"} opened {when(d.openedAt)} · {d.status}
                    {d.rulingClassId ? ` · ruling: ${cls(d.rulingClassId)} by ${d.reviewer ?? "a reviewer"} — “${d.rulingReason}”` : ""}
                  </li>
                ))}
              </ol>
            </section>
          </div>
        ) : null}
      </aside>
    </div>
  );
}
