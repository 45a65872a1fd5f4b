import type { AnnotatorRef, PairView } from "@/lib/agreement-server";
import { bandTone, coef, coefInterval } from "./format";

const who = (a: AnnotatorRef) => `${a.name}${a.you ? " (you)" : ""}`;

/** Cohen's kappa for every pair of annotators who share items: a symmetric table, n under each value. */
export function KappaMatrix({ pairs, annotators }: { pairs: PairView[]; annotators: AnnotatorRef[] }) {
  const involved = annotators.filter((a) => pairs.some((p) => p.a.index === a.index || p.b.index === a.index));
  const byKey = new Map(pairs.map((p) => [`${p.a.index}:${p.b.index}`, p]));
  const find = (i: number, j: number) => byKey.get(`${Math.min(i, j)}:${Math.max(i, j)}`);
  return (
    <div className="overflow-x-auto">
      <table className="border-separate border-spacing-1 text-sm">
        <caption className="sr-only">Cohen&apos;s kappa between each pair of annotators, with the number of items both labelled and the 95% interval</caption>
        <thead>
          <tr>
            <td />
            {involved.map((a) => (
              <th key={a.index} scope="col" className="max-w-[7rem] px-2 pb-1 text-left align-bottom text-xs font-bold text-ink-soft">
                {who(a)}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {involved.map((row) => (
            <tr key={row.index}>
              <th scope="row" className="whitespace-nowrap pr-3 text-right text-xs font-bold text-ink-soft">
                {who(row)}
              </th>
              {involved.map((col) => {
                if (col.index === row.index) return <td key={col.index} className="rounded-md bg-paper-sunk/60 text-center text-ink-faint" aria-label="same annotator">·</td>;
                const p = find(row.index, col.index);
                if (!p) return <td key={col.index} className="rounded-md border border-dashed border-line px-3 py-2 text-center text-xs text-ink-faint">no shared items</td>;
                const tone = p.kappa.band ? bandTone[p.kappa.band] : null;
                return (
                  <td key={col.index} className="min-w-[6.5rem] rounded-md px-3 py-2 align-top" style={tone ? { background: tone.fill, color: tone.text } : undefined} title={p.kappa.reading}>
                    <span className="num block text-base font-extrabold">κ {coef(p.kappa.value)}</span>
                    <span className="num block text-[11px] opacity-80">{coefInterval(p.kappa.ci95)}</span>
                    <span className="num block text-[11px] font-semibold opacity-80">n = {p.n}</span>
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
