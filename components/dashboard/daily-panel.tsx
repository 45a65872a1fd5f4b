"use client";

import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { DailyLabels } from "@/db/queries/dashboard";
import { annotatorPalette, axis, gridStroke, int, othersColour, shortDay, tooltipStyle } from "./format";
import { ChartTable, Legend, Panel, td, tdNum, th } from "./table";

const MAX_SERIES = 7;

type Series = { key: string; name: string; colour: string; members: number[]; you: boolean };

/** The busiest annotators get their own colour; the rest share one "others" series. */
function seriesOf(daily: DailyLabels): Series[] {
  const ranked = [...daily.annotators].sort((a, b) => b.total - a.total || a.index - b.index);
  const own = ranked.length > MAX_SERIES + 1 ? ranked.slice(0, MAX_SERIES) : ranked;
  const rest = ranked.slice(own.length);
  const series: Series[] = own
    .sort((a, b) => a.index - b.index)
    .map((a, i) => ({ key: `a${a.index}`, name: a.you ? `${a.name} (you)` : a.name, colour: annotatorPalette[i % annotatorPalette.length], members: [a.index], you: a.you }));
  if (rest.length) series.push({ key: "others", name: `${rest.length} others`, colour: othersColour, members: rest.map((a) => a.index), you: false });
  return series;
}

/** Live labels per day in the chosen window, stacked by annotator. */
export function DailyPanel({ daily }: { daily: DailyLabels }) {
  const series = seriesOf(daily);
  const seriesOfIndex = new Map(series.flatMap((s) => s.members.map((m) => [m, s.key] as const)));
  const rows = daily.days.map((day) => {
    const row: Record<string, number | string> = { day, total: 0 };
    for (const s of series) row[s.key] = 0;
    return row;
  });
  const rowOf = new Map(rows.map((r) => [r.day as string, r]));
  for (const c of daily.cells) {
    const row = rowOf.get(c.day);
    const key = seriesOfIndex.get(c.annotator);
    if (!row || !key) continue;
    row[key] = (row[key] as number) + c.count;
    row.total = (row.total as number) + c.count;
  }
  const total = rows.reduce((s, r) => s + (r.total as number), 0);
  const active = rows.filter((r) => (r.total as number) > 0);
  const busiest = active.reduce<(typeof rows)[number] | null>((best, r) => (!best || (r.total as number) > (best.total as number) ? r : best), null);
  const verdict = total
    ? `${int(total)} labels by ${daily.annotators.length} ${daily.annotators.length === 1 ? "annotator" : "annotators"} in ${daily.days.length} days; ${int(Math.round(total / active.length))} per active day`
    : `No labels in the last ${daily.days.length} days`;
  const interval = Math.max(0, Math.ceil(daily.days.length / 10) - 1);
  return (
    <Panel id="daily" title={`Labels per annotator per day · last ${daily.days.length} days`} verdict={verdict}>
      <div className="h-64" role="img" aria-label={`Labels per day, stacked by annotator. ${total ? `Busiest day ${shortDay(busiest!.day as string)} with ${int(busiest!.total as number)} labels.` : "No labels."} Numbers in the table below.`}>
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={rows} margin={{ top: 8, right: 8, bottom: 0, left: 0 }} barCategoryGap="18%">
            <CartesianGrid vertical={false} stroke={gridStroke} />
            <XAxis dataKey="day" tickFormatter={shortDay} interval={interval} {...axis} />
            <YAxis width={40} allowDecimals={false} {...axis} />
            <Tooltip cursor={{ fill: "#ece8df" }} contentStyle={tooltipStyle} labelFormatter={(d) => shortDay(String(d))} formatter={(v, name) => [int(Number(v)), series.find((s) => s.key === name)?.name ?? String(name)]} />
            {series.map((s, i) => (
              <Bar key={s.key} dataKey={s.key} stackId="day" fill={s.colour} isAnimationActive={false} radius={i === series.length - 1 ? [3, 3, 0, 0] : 0} />
            ))}
          </BarChart>
        </ResponsiveContainer>
      </div>
      <Legend entries={series.map((s) => ({ key: s.key, label: s.name, colour: s.colour, strong: s.you }))} />
      <p className="mt-2 text-xs text-ink-faint">Live labels only (undone ones left out); days end at midnight {daily.timeZone === "UTC" ? "UTC" : `in ${daily.timeZone}`}.</p>
      <ChartTable caption={`Labels per day and annotator, last ${daily.days.length} days`}>
        <thead className="border-b border-line">
          <tr>
            <th scope="col" className={th}>Day</th>
            {series.map((s) => (
              <th key={s.key} scope="col" className={`${th} text-right normal-case`}>{s.name}</th>
            ))}
            <th scope="col" className={`${th} text-right`}>All</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-line">
          {rows.map((r) => (
            <tr key={r.day as string}>
              <th scope="row" className={`${td} num text-left font-semibold`}>{r.day as string}</th>
              {series.map((s) => (
                <td key={s.key} className={tdNum}>{int(r[s.key] as number)}</td>
              ))}
              <td className={`${tdNum} font-bold`}>{int(r.total as number)}</td>
            </tr>
          ))}
        </tbody>
      </ChartTable>
    </Panel>
  );
}
