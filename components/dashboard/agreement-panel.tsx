"use client";

import Link from "next/link";
import useSWR from "swr";
import type { AgreementSummary } from "./agreement-summary";
import { BandChip } from "@/components/agreement/band-chip";
import { coef, coefInterval, pctInterval } from "@/components/agreement/format";
import { fetcher } from "@/lib/client/api";
import { int, pct } from "./format";
import { IntervalStrip } from "./interval-strip";
import { ChartTable, Panel, td, tdNum, th } from "./table";

/** Agreement beyond chance: the headline alpha with its band and interval, never the number alone. */
export function AgreementPanel({ projectId }: { projectId: number }) {
  const { data, error } = useSWR<{ data: AgreementSummary }>(`/api/v1/projects/${projectId}/dashboard/agreement`, fetcher, {
    refreshInterval: (latest) => (latest?.data.status === "computing" || latest?.data.stale ? 5_000 : 60_000),
  });
  const s = data?.data;
  const h = s?.headline ?? null;
  const link = (
    <Link href={`/projects/${projectId}/agreement`} className="text-sm font-semibold text-pine-700 underline">
      Pairs, classes and annotators on the Agreement page
    </Link>
  );
  if (error) return <Panel id="agreement" title="Agreement" verdict="Agreement could not be loaded">{<p className="text-sm text-alarm-700">{error.message}</p>}</Panel>;
  if (!s) return <Panel id="agreement" title="Agreement" verdict="Loading…"><div className="h-40 animate-pulse rounded-md bg-paper-sunk" /></Panel>;
  if (s.status === "computing" || !h) {
    return (
      <Panel id="agreement" title="Agreement" verdict="Computing the first agreement report…">
        <p className="text-sm text-ink-soft" aria-live="polite">A background job is working on it; this card fills in by itself.</p>
      </Panel>
    );
  }
  const verdict =
    h.value === null ? (
      "Too few overlapping labels to measure agreement yet"
    ) : (
      <span className="inline-flex flex-wrap items-center gap-2">
        <span>
          <span className="font-serif italic">α</span> = <span className="num">{coef(h.value)}</span>
          <span className="num ml-2 text-sm font-semibold text-pine-700">95% CI {coefInterval(h.ci95)}</span>
        </span>
        <BandChip band={h.band} />
      </span>
    );
  return (
    <Panel id="agreement" title="Agreement beyond chance" verdict={verdict}>
      <p className="text-sm text-ink-soft">{h.reading}.</p>
      {s.stale ? <p className="mt-1 text-xs font-semibold text-amber-700" aria-live="polite">Newer labels are being included; these figures are from {new Date(s.computedAt!).toLocaleString("en-GB", { timeZone: "UTC" })} UTC.</p> : null}
      <div className="mt-3">
        <IntervalStrip figures={s.figures} />
      </div>
      <p className="mt-2 text-xs text-ink-faint">
        Bands after Landis &amp; Koch (1977). Blind items were labelled with the suggestion hidden, so their figure is free of anchoring. From {int(s.labels)} live labels.
        {s.percentAgreement?.value != null ? ` Raw percent agreement ${pct(s.percentAgreement.value)} (95% CI ${pctInterval(s.percentAgreement.ci95)}) is not corrected for chance.` : ""}
      </p>
      <div className="mt-2">{link}</div>
      <ChartTable caption="Agreement coefficients with 95% intervals and bands">
        <thead className="border-b border-line">
          <tr>
            <th scope="col" className={th}>Figure</th>
            <th scope="col" className={`${th} text-right`}>Value</th>
            <th scope="col" className={th}>95% CI</th>
            <th scope="col" className={th}>Band</th>
            <th scope="col" className={`${th} text-right`}>Items</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-line">
          {s.figures.map((f) => (
            <tr key={f.key}>
              <th scope="row" className={`${td} text-left font-semibold`}>{f.label}</th>
              <td className={`${tdNum} font-bold`}>{coef(f.value)}</td>
              <td className={`${td} num text-ink-soft`}>{f.value === null ? "—" : coefInterval(f.ci95)}</td>
              <td className={td}><BandChip band={f.band} /></td>
              <td className={tdNum}>{int(f.items)}</td>
            </tr>
          ))}
        </tbody>
      </ChartTable>
    </Panel>
  );
}
