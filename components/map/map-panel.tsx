"use client";

import { useMemo, useState } from "react";
import useSWR from "swr";
import { Card, EmptyState, Notice } from "@/components/ui/card";
import type { ReportView } from "@/components/tuning/types";
import { fetcher } from "@/lib/client/api";
import type { MapReport } from "@/lib/suggest/map";
import { MapCanvas } from "./map-canvas";

type ClassBrief = { id: number; name: string; colour: string };
type Payload = { data: { report: ReportView<MapReport>; version: number; classes: ClassBrief[] } };

export function MapPanel({ projectId }: { projectId: number }) {
  const { data, error } = useSWR<Payload>(`/api/v1/projects/${projectId}/map`, fetcher, {
    refreshInterval: (d) => (d && (d.data.report.status === "pending" || d.data.report.status === "running") ? 2000 : 0),
  });
  const [kIndex, setKIndex] = useState<number | null>(null);
  const report = data?.data.report;
  const result = report?.status === "succeeded" && report.result && !("empty" in report.result) ? (report.result as MapReport) : null;
  const classes = data?.data.classes;
  const colours = useMemo(() => (result && classes ? result.classIds.map((id) => classes.find((c) => c.id === id)?.colour ?? "#9aa0a8") : []), [result, classes]);

  if (error) return <Notice tone="error">{error instanceof Error ? error.message : "Could not load the Map."}</Notice>;
  if (!data || !report) return <p className="text-sm text-ink-soft">Projecting the items…</p>;
  if (report.status === "pending" || report.status === "running") {
    return <Notice title="Drawing the Map"><span className="num">{Math.round(100 * report.progress)}%</span> done; this page updates by itself.</Notice>;
  }
  if (report.status === "failed") return <Notice tone="error" title="The Map could not be drawn">{report.message}</Notice>;
  if (!result) return <EmptyState title="Nothing to draw yet">{report.result && "empty" in report.result ? report.result.reason : "Import items first."}</EmptyState>;

  const idx = kIndex ?? Math.max(0, result.ks.indexOf(result.projectK));
  const k = result.ks[idx];
  const counts = new Map<number, number>();
  for (const p of result.points) counts.set(p[3], (counts.get(p[3]) ?? 0) + 1);
  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_280px]">
      <Card>
        <MapCanvas report={result} k={k} colours={colours} label={`Map of ${result.points.length} items in the first two principal axes, with suggestion regions at k = ${k}`} />
        <div className="mt-4 flex flex-wrap items-center gap-4">
          <label htmlFor="map-k" className="text-sm font-semibold text-ink">
            Regions at <span className="num">k = {k}</span>
          </label>
          <input
            id="map-k"
            type="range"
            min={0}
            max={result.ks.length - 1}
            step={1}
            value={idx}
            onChange={(e) => setKIndex(Number(e.target.value))}
            aria-valuetext={`k = ${k}`}
            className="w-72 accent-pine-600"
          />
          <span className="text-xs text-ink-faint">
            {result.ks.join(" · ")} (project: k = {result.projectK})
          </span>
        </div>
      </Card>
      <div className="space-y-4">
        <Card title="Key">
          <ul className="space-y-1.5 text-sm">
            {result.classIds.map((id, ci) => {
              const c = classes?.find((x) => x.id === id);
              return (
                <li key={id} className="flex items-center gap-2">
                  <span className="h-3 w-3 rounded-full border border-paper-raised" style={{ background: c?.colour }} aria-hidden="true" />
                  <span className="flex-1">{c?.name}</span>
                  <span className="num text-xs text-ink-faint">{(counts.get(ci) ?? 0).toLocaleString("en")}</span>
                </li>
              );
            })}
            <li className="flex items-center gap-2">
              <span className="h-2 w-2 bg-[#9aa0a8]" aria-hidden="true" />
              <span className="flex-1">No final label yet</span>
              <span className="num text-xs text-ink-faint">{(counts.get(-1) ?? 0).toLocaleString("en")}</span>
            </li>
          </ul>
          <p className="mt-3 text-xs text-ink-faint">Tinted areas: the class the k nearest labelled points vote for there; deeper tint = more one-sided vote. Lines mark where the vote changes.</p>
        </Card>
        <Card title="How this is drawn">
          <p className="text-xs leading-relaxed text-ink-soft">{result.method}.</p>
          <p className="mt-2 text-xs leading-relaxed text-ink-soft">{result.sampling}</p>
          <p className="mt-2 text-xs text-ink-faint">
            {result.items.toLocaleString("en")} items, {result.voters.toLocaleString("en")} voting; the two axes keep {(100 * (result.explainedVariance[0] + result.explainedVariance[1])).toFixed(0)}% of the variance of the scaled features.
          </p>
        </Card>
      </div>
    </div>
  );
}
