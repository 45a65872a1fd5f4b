"use client";

import { Bar, BarChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { ProgressCounts } from "@/db/queries/dashboard";
import { int, pct, railOrder, statusLook, tooltipStyle } from "./format";
import { PROGRESS_STATUSES } from "./rules";
import { ChartTable, Panel, td, tdNum, th } from "./table";

/** One rail for all items: finished work (agreed, ruled) from the left, what is open to the right. */
export function ProgressPanel({ progress }: { progress: ProgressCounts }) {
  const { total, counts, leased } = progress;
  const work = total - counts.control;
  const decided = counts.agreed + counts.ruled;
  const row = Object.fromEntries(railOrder.map((s) => [s, counts[s]]));
  const summary = railOrder.map((s) => `${statusLook[s].label} ${int(counts[s])}`).join(", ");
  return (
    <Panel
      id="progress"
      title="Progress"
      verdict={
        <>
          <span className="num">{pct(work ? decided / work : null)}</span> of {int(work)} items to label have a final label
          {counts.disputed ? <span className="text-alarm-700">; {int(counts.disputed)} wait in Disputes</span> : null}
        </>
      }
    >
      <div className="h-14" role="img" aria-label={`Items by status, ${int(total)} in all: ${summary}.`}>
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={[row]} layout="vertical" margin={{ top: 0, right: 0, bottom: 0, left: 0 }} barCategoryGap={0}>
            <XAxis type="number" hide domain={[0, Math.max(1, total)]} />
            <YAxis type="category" hide />
            <Tooltip cursor={false} contentStyle={tooltipStyle} formatter={(v, name) => [`${int(Number(v))} (${pct(total ? Number(v) / total : null, 1)})`, statusLook[name as keyof typeof statusLook].label]} />
            {railOrder.map((s, i) => (
              <Bar key={s} dataKey={s} stackId="rail" fill={statusLook[s].fill} isAnimationActive={false} radius={i === 0 ? [6, 0, 0, 6] : i === railOrder.length - 1 ? [0, 6, 6, 0] : 0} />
            ))}
          </BarChart>
        </ResponsiveContainer>
      </div>
      <ul className="mt-4 grid grid-cols-2 gap-x-4 gap-y-3 sm:grid-cols-3">
        {railOrder.map((s) => (
          <li key={s} className="border-l-4 pl-2" style={{ borderColor: statusLook[s].fill }}>
            <p className="whitespace-nowrap text-xs font-bold uppercase tracking-[0.08em] text-ink-soft">{statusLook[s].label}</p>
            <p className="num text-xl font-bold text-ink">{int(counts[s])}</p>
            <p className="num text-xs text-ink-faint">{pct(total ? counts[s] / total : null, 1)}</p>
          </li>
        ))}
      </ul>
      <p className="mt-3 text-xs text-ink-faint">
        {int(leased)} {leased === 1 ? "item is" : "items are"} open on a Desk right now (counted as in progress). Control items have a known label and are not counted as work to do.
      </p>
      <ChartTable caption="Items by status">
        <thead className="border-b border-line">
          <tr>
            <th scope="col" className={th}>Status</th>
            <th scope="col" className={th}>Meaning</th>
            <th scope="col" className={`${th} text-right`}>Items</th>
            <th scope="col" className={`${th} text-right`}>Share</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-line">
          {PROGRESS_STATUSES.map((s) => (
            <tr key={s}>
              <th scope="row" className={`${td} text-left font-semibold`}>{statusLook[s].label}</th>
              <td className={`${td} text-ink-soft`}>{statusLook[s].hint}</td>
              <td className={tdNum}>{int(counts[s])}</td>
              <td className={tdNum}>{pct(total ? counts[s] / total : null, 1)}</td>
            </tr>
          ))}
          <tr className="font-bold">
            <th scope="row" className={`${td} text-left`}>All items</th>
            <td className={td} />
            <td className={tdNum}>{int(total)}</td>
            <td className={tdNum}>100%</td>
          </tr>
        </tbody>
      </ChartTable>
    </Panel>
  );
}
