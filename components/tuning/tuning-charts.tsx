"use client";

import { CartesianGrid, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { TuningResult } from "@/lib/knn";
import { distanceLook } from "./types";

type Metric = "accuracy" | "macroF1" | "logLoss";

function rowsFor(results: TuningResult[], metric: Metric) {
  const ks = [...new Set(results.map((r) => r.k))].sort((a, b) => a - b);
  return ks.map((k) => {
    const row: Record<string, number> = { k };
    for (const r of results) if (r.k === k) row[r.distance] = r[metric];
    return row;
  });
}

/** One metric against k, a line per distance (colour and dash both tell them apart), the chosen k marked. */
export function MetricChart({ results, metric, title, chosenK, percent }: { results: TuningResult[]; metric: Metric; title: string; chosenK: number; percent: boolean }) {
  const distances = [...new Set(results.map((r) => r.distance))];
  const fmt = (v: number) => (percent ? `${(100 * v).toFixed(0)}%` : v.toFixed(2));
  return (
    <figure className="rounded-md border border-line bg-paper p-3">
      <figcaption className="mb-2 text-xs font-bold uppercase tracking-[0.1em] text-ink-soft">{title}</figcaption>
      <div className="h-56" aria-hidden="true">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={rowsFor(results, metric)} margin={{ top: 6, right: 12, bottom: 4, left: 0 }}>
            <CartesianGrid stroke="#d9d3c7" strokeDasharray="1 4" vertical={false} />
            <XAxis dataKey="k" type="number" domain={[1, "dataMax"]} ticks={[1, 5, 11, 21, 31, 41, 51]} tick={{ fontSize: 11, fill: "#6b7282" }} stroke="#b9b1a2" />
            <YAxis width={44} tickFormatter={fmt} tick={{ fontSize: 11, fill: "#6b7282" }} stroke="#b9b1a2" domain={["auto", "auto"]} />
            <ReferenceLine x={chosenK} stroke="#d9a441" strokeWidth={6} strokeOpacity={0.35} />
            <Tooltip
              formatter={(v, name) => [fmt(Number(v)), distanceLook[String(name)]?.label ?? String(name)]}
              labelFormatter={(k) => `k = ${k}`}
              contentStyle={{ background: "#fffdf8", border: "1px solid #d9d3c7", borderRadius: 6, fontSize: 12 }}
            />
            {distances.map((d) => (
              <Line key={d} dataKey={d} type="linear" stroke={distanceLook[d].colour} strokeDasharray={distanceLook[d].dash} strokeWidth={2} dot={{ r: 1.6 }} isAnimationActive={false} />
            ))}
          </LineChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}

export function DistanceKey({ distances }: { distances: string[] }) {
  return (
    <ul className="flex flex-wrap gap-4 text-xs text-ink-soft">
      {distances.map((d) => (
        <li key={d} className="inline-flex items-center gap-2">
          <svg width="28" height="8" aria-hidden="true">
            <line x1="0" y1="4" x2="28" y2="4" stroke={distanceLook[d].colour} strokeWidth="2.5" strokeDasharray={distanceLook[d].dash} />
          </svg>
          {distanceLook[d].label}
        </li>
      ))}
      <li className="inline-flex items-center gap-2">
        <span className="inline-block h-3 w-2 rounded-sm bg-amber-500/40" aria-hidden="true" /> selected k
      </li>
    </ul>
  );
}
