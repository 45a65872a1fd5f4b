"use client";

import { useState } from "react";
import useSWR from "swr";
import { ageText } from "@/components/desk/format";
import type { DeskClass, DeskColumn } from "@/components/desk/types";
import { Button } from "@/components/ui/button";
import { EmptyState, Notice } from "@/components/ui/card";
import { Select } from "@/components/ui/field";
import { fetcher } from "@/lib/client/api";
import { ClassChip } from "./class-chip";
import { DisputeDetail } from "./dispute-detail";
import type { DisputeList } from "./types";

const ages = {
  any: {},
  day: { maxAgeHours: 24 },
  week: { minAgeHours: 24, maxAgeHours: 168 },
  older: { minAgeHours: 168 },
} as const;
type Age = keyof typeof ages;

/** Disputes: filters, the list (oldest first) and the selected dispute with its Ruling. */
export function DisputesBoard({ projectId, classes, columns }: { projectId: number; classes: DeskClass[]; columns: DeskColumn[] }) {
  const [status, setStatus] = useState<"open" | "ruled">("open");
  const [reason, setReason] = useState<"" | "disagreement" | "doubt">("");
  const [pair, setPair] = useState("");
  const [age, setAge] = useState<Age>("any");
  const [selected, setSelected] = useState<number | null>(null);
  const [flash, setFlash] = useState<string | null>(null);
  const byId = new Map(classes.map((c) => [c.id, c]));
  const q = new URLSearchParams({ status, limit: "100" });
  if (reason) q.set("reason", reason);
  if (pair) {
    const [a, b] = pair.split("-");
    q.set("classA", a);
    if (b) q.set("classB", b);
  }
  for (const [k, v] of Object.entries(ages[age])) q.set(k, String(v));
  const { data, error, mutate } = useSWR<DisputeList>(`/api/v1/projects/${projectId}/disputes?${q}`, fetcher, { keepPreviousData: true });
  const rows = data?.data ?? [];
  const current = selected ?? rows[0]?.id ?? null;

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
      <section aria-label="Dispute list" className="space-y-3">
        <div className="grid grid-cols-2 gap-2">
          <label className="text-xs font-semibold text-ink-soft">
            Status
            <Select value={status} onChange={(e) => { setStatus(e.target.value as "open" | "ruled"); setSelected(null); }} className="mt-1">
              <option value="open">Open</option>
              <option value="ruled">Ruled</option>
            </Select>
          </label>
          <label className="text-xs font-semibold text-ink-soft">
            Kind
            <Select value={reason} onChange={(e) => { setReason(e.target.value as typeof reason); setSelected(null); }} className="mt-1">
              <option value="">All</option>
              <option value="disagreement">Annotators disagree</option>
              <option value="doubt">Doubted labels</option>
            </Select>
          </label>
          <label className="text-xs font-semibold text-ink-soft">
            Classes involved
            <Select value={pair} onChange={(e) => { setPair(e.target.value); setSelected(null); }} className="mt-1">
              <option value="">Any</option>
              {(data?.pairs ?? []).map((p) => (
                <option key={`${p.a}-${p.b}`} value={`${p.a}-${p.b}`}>
                  {byId.get(p.a)?.name} / {byId.get(p.b)?.name} ({p.n})
                </option>
              ))}
              {classes.map((c) => (
                <option key={c.id} value={String(c.id)}>
                  {c.name} (any pair)
                </option>
              ))}
            </Select>
          </label>
          <label className="text-xs font-semibold text-ink-soft">
            Age
            <Select value={age} onChange={(e) => { setAge(e.target.value as Age); setSelected(null); }} className="mt-1">
              <option value="any">Any age</option>
              <option value="day">Under a day</option>
              <option value="week">1 to 7 days</option>
              <option value="older">Over a week</option>
            </Select>
          </label>
        </div>
        <p className="text-sm text-ink-soft" aria-live="polite">
          {data ? `${data.total.toLocaleString("en")} ${status} dispute${data.total === 1 ? "" : "s"}${data.total > rows.length ? `, the oldest ${rows.length} shown` : ""}` : "Loading…"}
        </p>
        {error ? <Notice tone="error">Disputes could not be loaded: {(error as Error).message}</Notice> : null}
        {data && !rows.length ? <EmptyState title={status === "open" ? "No open disputes" : "No rulings yet"}>{status === "open" ? "Nothing here matches; annotators agree so far." : "Rulings appear here once issued."}</EmptyState> : null}
        <ul className="max-h-[calc(100vh-16rem)] space-y-1.5 overflow-y-auto pr-1" aria-label="Open disputes">
          {rows.map((d) => (
            <li key={d.id}>
              <button
                type="button"
                onClick={() => {
                  setSelected(d.id);
                  setFlash(null);
                }}
                aria-current={d.id === current ? "true" : undefined}
                className={`w-full rounded-md border px-3 py-2 text-left ${d.id === current ? "border-pine-600 bg-pine-50" : "border-line bg-paper-raised hover:border-line-strong"}`}
              >
                <span className="flex items-center gap-2">
                  <span className="num text-sm font-bold text-ink">{d.externalId}</span>
                  <span className={`rounded-full px-2 py-0.5 text-[11px] font-bold uppercase tracking-wide ${d.reason === "doubt" ? "bg-amber-100 text-amber-700" : "bg-paper-sunk text-ink-soft"}`}>{d.reason === "doubt" ? "doubt" : "disagree"}</span>
                  <span className="ml-auto text-xs text-ink-faint">{ageText(d.openedAt)}</span>
                </span>
                <span className="mt-1.5 flex flex-wrap gap-1">
                  {d.reason === "doubt" && d.finalClassId != null ? <ClassChip cls={byId.get(d.finalClassId)} strong /> : null}
                  {d.labels.map((l) => (
                    <ClassChip key={l.labelId} cls={byId.get(l.classId)} />
                  ))}
                </span>
              </button>
            </li>
          ))}
        </ul>
        {data?.next ? <p className="text-xs text-ink-faint">Rule on these first, or narrow the filters, to see more.</p> : null}
      </section>
      <section aria-label="Selected dispute" className="space-y-3">
        {flash ? <Notice tone="success">{flash}</Notice> : null}
        {current != null ? (
          <DisputeDetail
            key={current}
            projectId={projectId}
            disputeId={current}
            classes={classes}
            columns={columns}
            onRuled={(text, mine) => {
              // After your own ruling the next open dispute comes up; after a conflict this one stays, showing the ruling that stands.
              setFlash(mine ? text : null);
              setSelected(mine ? null : current);
              void mutate();
            }}
          />
        ) : (
          <Button variant="secondary" onClick={() => void mutate()}>
            Refresh
          </Button>
        )}
      </section>
    </div>
  );
}
