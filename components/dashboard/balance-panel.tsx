"use client";

import { Bar, BarChart, CartesianGrid, Cell, LabelList, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { ClassBalance } from "@/db/queries/dashboard";
import { axis, gridStroke, int, pct, tooltipStyle } from "./format";
import { ChartTable, Panel, Swatch, td, tdNum, th } from "./table";

/** Final labels per class, bars in each class's own colour, the rare line drawn across. */
export function BalancePanel({ balance }: { balance: ClassBalance }) {
  const { finalTotal, threshold, classes } = balance;
  const rare = classes.filter((c) => c.rare);
  const data = classes.map((c) => ({ name: c.name, share: c.share ?? 0, count: c.count, colour: c.colour, rare: c.rare }));
  const maxShare = Math.max(threshold * 1.3, ...data.map((d) => d.share));
  const verdict =
    finalTotal === 0 ? "No final labels yet" : rare.length ? `${rare.length} of ${classes.length} classes ${rare.length === 1 ? "is" : "are"} rare` : `No rare class among ${int(finalTotal)} final labels`;
  const C = classes.length;
  return (
    <Panel id="balance" title="Class balance of final labels" verdict={verdict}>
      {finalTotal > 0 ? (
        <div style={{ height: 48 + 30 * classes.length }} role="img" aria-label={`Share of final labels per class: ${data.map((d) => `${d.name} ${pct(d.share, 1)} (${int(d.count)})${d.rare ? ", rare" : ""}`).join("; ")}.`}>
          <ResponsiveContainer width="100%" height="100%">
            <BarChart data={data} layout="vertical" margin={{ top: 20, right: 40, bottom: 4, left: 4 }} barCategoryGap={6}>
              <CartesianGrid horizontal={false} stroke={gridStroke} />
              <XAxis type="number" domain={[0, Math.min(1, maxShare * 1.05)]} tickFormatter={(v) => pct(Number(v))} {...axis} />
              <YAxis type="category" dataKey="name" width={110} tickFormatter={(v: string) => (data.find((d) => d.name === v)?.rare ? `⚠ ${v}` : v)} {...axis} tick={{ ...axis.tick, fontWeight: 600 }} />
              <Tooltip cursor={{ fill: "#ece8df" }} contentStyle={tooltipStyle} formatter={(v, _n, p) => [`${pct(Number(v), 1)} (${int((p.payload as { count: number }).count)} items)`, "share"]} />
              <ReferenceLine x={threshold} stroke="#8a6216" strokeDasharray="4 3" label={{ value: `rare < ${pct(threshold, 1)}`, position: "top", fontSize: 10.5, fill: "#8a6216" }} />
              <Bar dataKey="share" isAnimationActive={false} radius={[0, 4, 4, 0]}>
                {data.map((d) => (
                  <Cell key={d.name} fill={d.colour} stroke={d.rare ? "#8a6216" : undefined} strokeWidth={d.rare ? 2 : 0} />
                ))}
                <LabelList dataKey="count" position="right" formatter={(v) => int(Number(v))} style={{ fontSize: 11, fill: "#1d2433", fontWeight: 600 }} />
              </Bar>
            </BarChart>
          </ResponsiveContainer>
        </div>
      ) : (
        <p className="text-sm text-ink-soft">Classes appear here as items get their final labels.</p>
      )}
      {rare.length ? (
        <p role="note" className="mt-2 rounded-md border border-amber-100 bg-amber-50 px-3 py-2 text-sm text-amber-700">
          <span className="font-bold">Rare: {rare.map((c) => c.name).join(", ")}.</span> A model trained on this set may rarely predict {rare.length === 1 ? "it" : "them"}; consider labelling more items near {rare.length === 1 ? "it" : "them"} or weighting by class.
        </p>
      ) : null}
      <p className="mt-2 text-xs text-ink-faint">
        Rule (common practice, not a standard): a class is marked rare when it holds under 5% of the final labels <em>and</em> under a third of an even share, 1/(3·C) = {pct(C ? 1 / (3 * C) : null, 1)} for C = {C} classes. Here the line sits at {pct(threshold, 1)}.
      </p>
      <ChartTable caption="Final labels per class and where they came from">
        <thead className="border-b border-line">
          <tr>
            <th scope="col" className={th}>Class</th>
            <th scope="col" className={`${th} text-right`}>Final</th>
            <th scope="col" className={`${th} text-right`}>Share</th>
            <th scope="col" className={`${th} text-right`}>Agreed</th>
            <th scope="col" className={`${th} text-right`}>Ruling</th>
            <th scope="col" className={`${th} text-right`}>Single</th>
            <th scope="col" className={`${th} text-right`}>Control</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-line">
          {classes.map((c) => (
            <tr key={c.classId}>
              <th scope="row" className={`${td} text-left font-semibold`}>
                <span className="inline-flex items-center gap-2"><Swatch colour={c.colour} />{c.name}{c.rare ? <span className="text-xs font-bold text-amber-700">rare</span> : null}</span>
              </th>
              <td className={tdNum}>{int(c.count)}</td>
              <td className={tdNum}>{pct(c.share, 1)}</td>
              <td className={tdNum}>{int(c.bySource.agreed)}</td>
              <td className={tdNum}>{int(c.bySource.ruling)}</td>
              <td className={tdNum}>{int(c.bySource.single)}</td>
              <td className={tdNum}>{int(c.bySource.control)}</td>
            </tr>
          ))}
        </tbody>
      </ChartTable>
    </Panel>
  );
}
