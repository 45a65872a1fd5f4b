"use client";

import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { ClassBalanceRow, SuggestionUse } from "@/db/queries/dashboard";
import { wilsonProportion } from "@/lib/agreement/proportion";
import { axis, gridStroke, int, pct, pctInterval, tooltipStyle } from "./format";
import { ChartTable, Legend, Panel, Swatch, td, tdNum, th } from "./table";

const parts = [
  { key: "took", label: "Took (Enter)", colour: "#1f5f5b" },
  { key: "sameByKey", label: "Same class by key", colour: "#9cc7c0" },
  { key: "overridden", label: "Overrode", colour: "#b4442f" },
] as const;

/** For each suggested class: how often the shown suggestion was taken, matched by key, or overridden. */
export function SuggestionPanel({ use, classes }: { use: SuggestionUse; classes: ClassBalanceRow[] }) {
  const byId = new Map(classes.map((c) => [c.classId, c]));
  const rows = use.byClass.map((r) => {
    const c = byId.get(r.classId);
    return {
      ...r,
      name: c?.name ?? `removed class ${r.classId}`,
      colour: c?.colour ?? "#6b7282",
      take: wilsonProportion(r.took, r.shown),
      override: wilsonProportion(r.overridden, r.shown),
      tookShare: r.took / r.shown,
      sameByKeyShare: r.sameByKey / r.shown,
      overriddenShare: r.overridden / r.shown,
    };
  });
  const shown = rows.reduce((s, r) => s + r.shown, 0);
  const take = wilsonProportion(rows.reduce((s, r) => s + r.took, 0), shown);
  const override = wilsonProportion(rows.reduce((s, r) => s + r.overridden, 0), shown);
  const verdict = shown ? `Took ${pct(take.value)} of shown suggestions, overrode ${pct(override.value)}` : "No label was given with a suggestion on screen yet";
  return (
    <Panel id="suggestions" title="Suggestion use by suggested class" verdict={verdict}>
      {shown ? (
        <>
          <div style={{ height: 40 + 30 * rows.length }} role="img" aria-label={`Per suggested class, share taken, matched by key and overridden: ${rows.map((r) => `${r.name}: took ${pct(r.take.value)}, overrode ${pct(r.override.value)} of ${int(r.shown)}`).join("; ")}.`}>
            <ResponsiveContainer width="100%" height="100%">
              <BarChart data={rows} layout="vertical" margin={{ top: 4, right: 12, bottom: 4, left: 4 }} barCategoryGap={6}>
                <CartesianGrid horizontal={false} stroke={gridStroke} />
                <XAxis type="number" domain={[0, 1]} ticks={[0, 0.25, 0.5, 0.75, 1]} tickFormatter={(v) => pct(Number(v))} {...axis} />
                <YAxis type="category" dataKey="name" width={110} {...axis} tick={{ ...axis.tick, fontWeight: 600 }} />
                <Tooltip cursor={{ fill: "#ece8df" }} contentStyle={tooltipStyle} formatter={(v, name) => [pct(Number(v)), parts.find((p) => `${p.key}Share` === name)?.label ?? String(name)]} />
                {parts.map((p) => (
                  <Bar key={p.key} dataKey={`${p.key}Share`} stackId="use" fill={p.colour} isAnimationActive={false} />
                ))}
              </BarChart>
            </ResponsiveContainer>
          </div>
          <Legend entries={parts} />
        </>
      ) : null}
      <p className="mt-2 text-xs text-ink-faint">
        From {int(use.shownLabels)} live labels given with the suggestion on screen; {int(use.hiddenLabels)} blind labels and {int(use.noSuggestion)} without any suggestion are left out. Suggestions anchor people: a high take-rate is not accuracy (blind items measure that, on the Agreement page).
      </p>
      <ChartTable caption="Suggestion take-rate and override rate by suggested class, with Wilson 95% intervals">
        <thead className="border-b border-line">
          <tr>
            <th scope="col" className={th}>Suggested class</th>
            <th scope="col" className={`${th} text-right`}>Shown</th>
            <th scope="col" className={`${th} text-right`}>Took</th>
            <th scope="col" className={`${th} text-right`}>Same by key</th>
            <th scope="col" className={`${th} text-right`}>Overrode</th>
            <th scope="col" className={`${th} text-right`}>Take-rate (95% CI)</th>
            <th scope="col" className={`${th} text-right`}>Override rate (95% CI)</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-line">
          {rows.map((r) => (
            <tr key={r.classId}>
              <th scope="row" className={`${td} text-left font-semibold`}>
                <span className="inline-flex items-center gap-2"><Swatch colour={r.colour} />{r.name}</span>
              </th>
              <td className={tdNum}>{int(r.shown)}</td>
              <td className={tdNum}>{int(r.took)}</td>
              <td className={tdNum}>{int(r.sameByKey)}</td>
              <td className={tdNum}>{int(r.overridden)}</td>
              <td className={tdNum}>{pct(r.take.value)} ({pctInterval(r.take.ci95)})</td>
              <td className={tdNum}>{pct(r.override.value)} ({pctInterval(r.override.ci95)})</td>
            </tr>
          ))}
          {rows.length ? (
            <tr className="font-bold">
              <th scope="row" className={`${td} text-left`}>All classes</th>
              <td className={tdNum}>{int(shown)}</td>
              <td className={tdNum}>{int(take.successes)}</td>
              <td className={tdNum}>{int(shown - take.successes - override.successes)}</td>
              <td className={tdNum}>{int(override.successes)}</td>
              <td className={tdNum}>{pct(take.value)} ({pctInterval(take.ci95)})</td>
              <td className={tdNum}>{pct(override.value)} ({pctInterval(override.ci95)})</td>
            </tr>
          ) : null}
        </tbody>
      </ChartTable>
    </Panel>
  );
}
