"use client";

import Link from "next/link";
import { Bar, BarChart, CartesianGrid, LabelList, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { OpenDisputes } from "@/db/queries/dashboard";
import { ageText, axis, gridStroke, int, tooltipStyle } from "./format";
import { ChartTable, Legend, Panel, td, tdNum, th } from "./table";

const reasons = [
  { key: "disagreement", label: "Annotators disagree", colour: "#b4442f" },
  { key: "doubt", label: "Doubted label", colour: "#d9a441" },
] as const;

/** Open disputes by how long they have waited, split by why they were opened. */
export function DisputesPanel({ disputes, projectId, canReview, now }: { disputes: OpenDisputes; projectId: number; canReview: boolean; now: number }) {
  const oldestHours = disputes.oldestOpenedAt ? (now - Date.parse(disputes.oldestOpenedAt)) / 3_600_000 : null;
  const verdict = disputes.open
    ? `${int(disputes.open)} open; the oldest has waited ${ageText(oldestHours ?? 0)}`
    : "No open disputes";
  const stale = disputes.buckets.filter((b) => b.key === "month" || b.key === "older").reduce((s, b) => s + b.total, 0);
  return (
    <Panel id="disputes" title="Open disputes by age" verdict={verdict}>
      <div className="h-48" role="img" aria-label={`Open disputes by age: ${disputes.buckets.map((b) => `${b.label} ${b.total}`).join(", ")}.`}>
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={disputes.buckets} margin={{ top: 16, right: 8, bottom: 0, left: 0 }} barCategoryGap="22%">
            <CartesianGrid vertical={false} stroke={gridStroke} />
            <XAxis dataKey="label" {...axis} interval={0} />
            <YAxis width={32} allowDecimals={false} {...axis} />
            <Tooltip cursor={{ fill: "#ece8df" }} contentStyle={tooltipStyle} formatter={(v, name) => [int(Number(v)), reasons.find((r) => r.key === name)?.label ?? String(name)]} />
            {reasons.map((r, i) => (
              <Bar key={r.key} dataKey={r.key} stackId="age" fill={r.colour} isAnimationActive={false} radius={i === reasons.length - 1 ? [3, 3, 0, 0] : 0}>
                {i === reasons.length - 1 ? <LabelList dataKey="total" position="top" formatter={(v) => (Number(v) ? int(Number(v)) : "")} style={{ fontSize: 11, fontWeight: 700, fill: "#1d2433" }} /> : null}
              </Bar>
            ))}
          </BarChart>
        </ResponsiveContainer>
      </div>
      <Legend entries={reasons} />
      {disputes.medianAgeHours !== null ? <p className="mt-2 text-xs text-ink-faint">Median wait {ageText(disputes.medianAgeHours)}.{stale ? ` ${int(stale)} waited over a week.` : ""}</p> : null}
      {canReview && disputes.open ? (
        <Link href={`/projects/${projectId}/disputes`} className="mt-2 inline-block text-sm font-semibold text-pine-700 underline">
          Work the Disputes queue
        </Link>
      ) : null}
      <ChartTable caption="Open disputes by age and reason">
        <thead className="border-b border-line">
          <tr>
            <th scope="col" className={th}>Waiting</th>
            {reasons.map((r) => (
              <th key={r.key} scope="col" className={`${th} text-right`}>{r.label}</th>
            ))}
            <th scope="col" className={`${th} text-right`}>All</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-line">
          {disputes.buckets.map((b) => (
            <tr key={b.key}>
              <th scope="row" className={`${td} text-left font-semibold`}>{b.label}</th>
              <td className={tdNum}>{int(b.disagreement)}</td>
              <td className={tdNum}>{int(b.doubt)}</td>
              <td className={`${tdNum} font-bold`}>{int(b.total)}</td>
            </tr>
          ))}
        </tbody>
      </ChartTable>
    </Panel>
  );
}
