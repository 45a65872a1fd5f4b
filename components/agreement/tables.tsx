import type { Proportion } from "@/lib/agreement";
import type { AnnotatorView, ClassView } from "@/lib/agreement-server";
import { BandChip } from "./band-chip";
import { coef, coefInterval, pct, pctInterval } from "./format";

const th = "px-3 py-2 text-left text-xs font-bold uppercase tracking-[0.08em] text-ink-faint";
const td = "px-3 py-2 align-top";

function Share({ p }: { p: Proportion }) {
  if (p.total === 0 || p.value === null) return <span className="text-ink-faint">—</span>;
  return (
    <span className="num">
      <span className="font-semibold text-ink">{pct(p.value)}</span> <span className="text-xs text-ink-faint">({p.successes}/{p.total}; {pctInterval(p.ci95)})</span>
    </span>
  );
}

export function ClassTable({ rows }: { rows: ClassView[] }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <caption className="sr-only">Agreement per class: one-vs-rest Krippendorff&apos;s alpha with its 95% interval</caption>
        <thead className="border-b border-line">
          <tr>
            <th scope="col" className={th}>Class</th>
            <th scope="col" className={`${th} text-right`}>Labels on shared items</th>
            <th scope="col" className={`${th} text-right`}><span className="normal-case">α</span> one vs rest</th>
            <th scope="col" className={th}>95% CI</th>
            <th scope="col" className={th}>Band</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-line">
          {rows.map((r) => (
            <tr key={r.class.index}>
              <th scope="row" className={`${td} text-left font-semibold text-ink`}>
                <span className="inline-flex items-center gap-2">
                  <span className="h-2.5 w-2.5 rounded-sm" style={{ background: r.class.colour }} aria-hidden="true" />
                  {r.class.name}
                </span>
              </th>
              <td className={`${td} num text-right`}>{r.ratings.toLocaleString("en")}</td>
              <td className={`${td} num text-right font-bold`}>{coef(r.alpha.value)}</td>
              <td className={`${td} num text-ink-soft`}>{r.alpha.value === null ? "—" : coefInterval(r.alpha.ci95)}</td>
              <td className={td}><BandChip band={r.alpha.band} /></td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export function AnnotatorTable({ rows }: { rows: AnnotatorView[] }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <caption className="sr-only">Per annotator: agreement with the others, with the final label, control-item accuracy and suggestion take-rate</caption>
        <thead className="border-b border-line">
          <tr>
            <th scope="col" className={th}>Annotator</th>
            <th scope="col" className={`${th} text-right`}>Labels</th>
            <th scope="col" className={`${th} text-right`}>Shared items</th>
            <th scope="col" className={th}><span className="normal-case">κ</span> vs others (95% CI)</th>
            <th scope="col" className={th}>Matches final label</th>
            <th scope="col" className={th}>Control items right</th>
            <th scope="col" className={th}>Took suggestion</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-line">
          {rows.map((r) => (
            <tr key={r.annotator.index} className={r.annotator.you ? "bg-pine-50/60" : undefined}>
              <th scope="row" className={`${td} whitespace-nowrap text-left font-semibold text-ink`}>
                {r.annotator.name}
                {r.annotator.you ? <span className="ml-1 text-xs font-bold text-pine-700">(you)</span> : null}
              </th>
              <td className={`${td} num text-right`}>{r.ratings.toLocaleString("en")}</td>
              <td className={`${td} num text-right`}>{r.sharedItems.toLocaleString("en")}</td>
              <td className={td}>
                <span className="inline-flex flex-wrap items-center gap-2">
                  <span className="num font-bold">{coef(r.kappaVsOthers.value)}</span>
                  {r.kappaVsOthers.value !== null ? <span className="num text-xs text-ink-faint">{coefInterval(r.kappaVsOthers.ci95)}</span> : null}
                  <BandChip band={r.kappaVsOthers.band} />
                </span>
              </td>
              <td className={td}><Share p={r.matchesFinal} /></td>
              <td className={td}><Share p={r.control} /></td>
              <td className={td}><Share p={r.takeRate} /></td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
