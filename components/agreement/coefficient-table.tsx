import type { ReportView } from "@/lib/agreement-server";
import { BandChip } from "./band-chip";
import { coef, coefInterval, pct, pctInterval } from "./format";

const th = "px-3 py-2 text-left text-xs font-bold uppercase tracking-[0.08em] text-ink-faint";

/** Every headline coefficient with value, interval, band and the report's reading sentence. */
export function CoefficientTable({ report: r }: { report: ReportView }) {
  const rows = [
    { name: "Krippendorff's alpha (nominal)", value: coef(r.krippendorffAlpha.value), ci: coefInterval(r.krippendorffAlpha.ci95), band: r.krippendorffAlpha.band, reading: r.krippendorffAlpha.reading, chip: true },
    { name: `Fleiss' kappa (${r.fleissKappa.items} items)`, value: coef(r.fleissKappa.value), ci: coefInterval(r.fleissKappa.ci95), band: r.fleissKappa.band, reading: r.fleissKappa.reading, chip: true },
    { name: "Percent agreement", value: pct(r.percentAgreement.value), ci: pctInterval(r.percentAgreement.ci95), band: null, reading: r.percentAgreement.reading, chip: false },
  ];
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <caption className="sr-only">Agreement coefficients with 95% intervals and reading bands</caption>
        <thead className="border-b border-line">
          <tr>
            <th scope="col" className={th}>Figure</th>
            <th scope="col" className={`${th} text-right`}>Value</th>
            <th scope="col" className={th}>95% CI</th>
            <th scope="col" className={th}>Band</th>
            <th scope="col" className={th}>Reading</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-line">
          {rows.map((row) => (
            <tr key={row.name}>
              <th scope="row" className="px-3 py-2 text-left font-semibold text-ink">{row.name}</th>
              <td className="num px-3 py-2 text-right font-bold">{row.value}</td>
              <td className="num px-3 py-2 text-ink-soft">{row.ci}</td>
              <td className="px-3 py-2">{row.chip ? <BandChip band={row.band} /> : <span className="text-xs text-ink-faint">not chance-corrected</span>}</td>
              <td className="px-3 py-2 text-ink-soft">{row.reading}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
