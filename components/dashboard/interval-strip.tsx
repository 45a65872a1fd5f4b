"use client";

import { CartesianGrid, ComposedChart, ErrorBar, ReferenceArea, ReferenceLine, ResponsiveContainer, Scatter, XAxis, YAxis } from "recharts";
import { axisStart, bandStripes, intervalPhrase } from "@/components/agreement/band-stripes";
import { formatCoefficient } from "@/lib/agreement/bands";
import type { SummaryFigure } from "./agreement-summary";
import { axis } from "./format";

/** Each figure as a diamond with its 95% interval as whiskers, over the reading bands. */
export function IntervalStrip({ figures }: { figures: SummaryFigure[] }) {
  const min = axisStart(figures, 0);
  const data = figures.map((f, row) => ({
    row,
    label: f.label.replace("Krippendorff's alpha", "α"),
    value: f.value,
    err: f.value !== null && f.ci95 ? [f.value - f.ci95.lower, f.ci95.upper - f.value] : [0, 0],
  }));
  const summary = figures
    .map((f) => `${f.label}: ${f.value === null ? "cannot be computed yet" : `${formatCoefficient(f.value)}${intervalPhrase(f.ci95)}`}`)
    .join("; ");
  return (
    <figure>
      <div style={{ height: 44 + 40 * data.length }} role="img" aria-label={`Agreement coefficients with bootstrap 95% intervals over the Landis and Koch bands. ${summary}.`}>
        <ResponsiveContainer width="100%" height="100%">
          <ComposedChart data={data} layout="vertical" margin={{ top: 18, right: 12, bottom: 0, left: 4 }}>
            {bandStripes
              .filter((b) => b.to > min)
              .map((b) => (
                <ReferenceArea key={b.name} x1={Math.max(b.from, min)} x2={b.to} fill={b.fill} fillOpacity={1} ifOverflow="hidden" label={{ value: b.name, position: "top", fontSize: 11, fill: "#4a5263", fontWeight: 600 }} />
              ))}
            <CartesianGrid horizontal={false} stroke="#d9d3c7" />
            <XAxis type="number" dataKey="value" domain={[min, 1]} ticks={[min, 0, 0.2, 0.4, 0.6, 0.8, 1].filter((t, i, all) => all.indexOf(t) === i)} tickFormatter={(v) => formatCoefficient(Number(v))} {...axis} />
            <YAxis
              type="number"
              dataKey="row"
              domain={[-0.5, data.length - 0.5]}
              ticks={data.map((d) => d.row)}
              tickFormatter={(v) => data[Number(v)]?.label ?? ""}
              width={128}
              {...axis}
              tick={{ ...axis.tick, fontSize: 12, fontWeight: 600, fill: "#1d2433" }}
            />
            {data.map((d) =>
              d.value === null ? <ReferenceLine key={d.row} y={d.row} stroke="none" label={{ value: "cannot be computed yet", position: "insideLeft", fontSize: 11.5, fontStyle: "italic", fill: "#6b7282" }} /> : null,
            )}
            <Scatter data={data.filter((d) => d.value !== null)} dataKey="value" shape="diamond" fill="#fffdf8" stroke="#17494a" strokeWidth={2.5} isAnimationActive={false}>
              <ErrorBar dataKey="err" direction="x" width={10} stroke="#17494a" strokeWidth={2.5} />
            </Scatter>
          </ComposedChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="mt-1 text-xs text-ink-faint">Diamond: the estimate. Whiskers: its bootstrap 95% interval. A figure that cannot be computed yet has no diamond.</figcaption>
    </figure>
  );
}
