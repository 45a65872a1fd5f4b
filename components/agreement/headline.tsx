import type { ReportView } from "@/lib/agreement-server";
import { BandChip } from "./band-chip";
import { coef, coefInterval, pct, pctInterval } from "./format";

function Figure({ name, symbol = "", value, interval, band, reading, note }: { name: string; symbol?: string; value: string; interval: string; band: React.ReactNode; reading: string; note?: string }) {
  return (
    <div className="flex flex-col rounded-card border border-line bg-paper p-4">
      <div className="flex items-start justify-between gap-2">
        <p className="text-xs font-bold uppercase tracking-[0.1em] text-ink-faint">{name}</p>
        {band}
      </div>
      <p className="mt-2 flex items-baseline gap-2">
        {symbol ? <span className="font-serif text-sm italic text-ink-soft">{symbol}</span> : null}
        <span className="num text-3xl font-extrabold text-ink">{value}</span>
      </p>
      <p className="num text-sm font-semibold text-pine-700">95% CI {interval}</p>
      <p className="mt-2 text-sm text-ink-soft">{reading}</p>
      {note ? <p className="mt-auto pt-2 text-xs text-ink-faint">{note}</p> : null}
    </div>
  );
}

/** The three headline figures, each with its interval, band and reading sentence from the report. */
export function Headline({ report }: { report: ReportView }) {
  const a = report.krippendorffAlpha;
  const f = report.fleissKappa;
  const p = report.percentAgreement;
  return (
    <div className="grid gap-4 md:grid-cols-3">
      <Figure name="Krippendorff's alpha" symbol="α" value={coef(a.value)} interval={coefInterval(a.ci95)} band={<BandChip band={a.band} />} reading={a.reading} note="The headline: uses every label, any number of annotators per item, missing labels allowed." />
      <Figure
        name="Fleiss' kappa"
        symbol="κ"
        value={coef(f.value)}
        interval={coefInterval(f.ci95)}
        band={<BandChip band={f.band} />}
        reading={f.reading}
        note={f.ratersPerItem ? `Over the ${f.items.toLocaleString("en")} items with exactly ${f.ratersPerItem} labels (the most common count).` : "Needs items with the same number of labels, at least two."}
      />
      <Figure name="Percent agreement" value={pct(p.value)} interval={pctInterval(p.ci95)} band={<span className="text-xs font-semibold text-ink-faint">no band</span>} reading={p.reading} note="Mean share of agreeing pairs of labels per item. Not corrected for chance, so it has no band." />
    </div>
  );
}
