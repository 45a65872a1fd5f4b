"use client";

import useSWRInfinite from "swr/infinite";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Card, EmptyState } from "@/components/ui/card";
import { Input } from "@/components/ui/field";
import { fetcher } from "@/lib/client/api";

type Row = { id: number; at: string; action: string; targetType: string; targetId: string | null; before: unknown; after: unknown; projectName: string | null; actorEmail: string | null };
type Page = { data: Row[]; nextBefore: number | null };

function brief(v: unknown) {
  if (v == null) return "";
  const s = JSON.stringify(v);
  return s.length > 140 ? `${s.slice(0, 140)}…` : s;
}

export function AuditTable({ endpoint, showProject, showActorFilter }: { endpoint: string; showProject: boolean; showActorFilter: boolean }) {
  const [action, setAction] = useState("");
  const [actor, setActor] = useState("");
  const qs = (before: number | null) => {
    const p = new URLSearchParams();
    if (action) p.set("action", action);
    if (actor && showActorFilter) p.set("actor", actor);
    if (before) p.set("before", String(before));
    return `${endpoint}?${p}`;
  };
  const { data, size, setSize, isLoading } = useSWRInfinite<Page>((i, prev) => (i === 0 ? qs(null) : prev?.nextBefore ? qs(prev.nextBefore) : null), fetcher);
  const rows = data?.flatMap((p) => p.data) ?? [];
  const more = data?.[data.length - 1]?.nextBefore;
  return (
    <Card title="Audit trail">
      <div className="mb-4 flex flex-wrap gap-3">
        <div className="w-56">
          <label htmlFor="audit-action" className="mb-1 block text-xs font-semibold text-ink-soft">Action starts with</label>
          <Input id="audit-action" placeholder="e.g. member., token." value={action} onChange={(e) => setAction(e.target.value)} />
        </div>
        {showActorFilter ? (
          <div className="w-56">
            <label htmlFor="audit-actor" className="mb-1 block text-xs font-semibold text-ink-soft">Actor e-mail contains</label>
            <Input id="audit-actor" value={actor} onChange={(e) => setActor(e.target.value)} />
          </div>
        ) : null}
      </div>
      {isLoading ? (
        <p className="text-sm text-ink-faint">Loading…</p>
      ) : rows.length === 0 ? (
        <EmptyState title="Nothing recorded">No audit entries match these filters.</EmptyState>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm">
            <thead className="text-xs uppercase tracking-[0.08em] text-ink-faint">
              <tr>
                <th className="py-2 pr-3">When</th>
                <th className="py-2 pr-3">Who</th>
                <th className="py-2 pr-3">Action</th>
                {showProject ? <th className="py-2 pr-3">Project</th> : null}
                <th className="py-2 pr-3">Target</th>
                <th className="py-2">Before → after</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-line align-top">
              {rows.map((r) => (
                <tr key={r.id}>
                  <td className="num whitespace-nowrap py-2 pr-3 text-xs">{new Date(r.at).toLocaleString("en-GB")}</td>
                  <td className="py-2 pr-3">{r.actorEmail ?? "system"}</td>
                  <td className="py-2 pr-3 font-semibold">{r.action}</td>
                  {showProject ? <td className="py-2 pr-3">{r.projectName ?? "—"}</td> : null}
                  <td className="py-2 pr-3 text-xs text-ink-soft">{r.targetType} {r.targetId}</td>
                  <td className="num py-2 text-xs text-ink-soft">
                    {brief(r.before)} {r.before != null || r.after != null ? "→" : ""} {brief(r.after)}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {more ? (
        <div className="mt-4">
          <Button variant="secondary" onClick={() => void setSize(size + 1)}>
            Older entries
          </Button>
        </div>
      ) : null}
    </Card>
  );
}
