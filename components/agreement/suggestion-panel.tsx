import type { Proportion } from "@/lib/agreement";
import type { SuggestionCounts, ReportView } from "@/lib/agreement-server";
import { Notice } from "@/components/ui/card";
import { describeProportion, pct } from "./format";

const W = 520;

/** One share with its Wilson interval on a 0–100% track. */
function ShareBar({ label, p, tone }: { label: string; p: Proportion; tone: "blind" | "shown" }) {
  const x = (v: number) => 8 + v * (W - 16);
  const colour = tone === "blind" ? "#17494a" : "#8a6216";
  return (
    <div className="grid items-center gap-x-4 gap-y-1 sm:grid-cols-[11rem_1fr]">
      <p className="text-sm font-semibold text-ink">{label}</p>
      <div>
        <svg viewBox={`0 0 ${W} 36`} className="block h-auto w-full max-w-[640px]" aria-hidden="true">
          <rect x={8} y={9} width={W - 16} height={8} rx={4} fill="#ece8df" />
          {[0.25, 0.5, 0.75].map((t) => (
            <line key={t} x1={x(t)} x2={x(t)} y1={6} y2={20} stroke="#d9d3c7" />
          ))}
          {[0, 0.5, 1].map((t) => (
            <text key={t} x={x(t)} y={33} textAnchor={t === 0 ? "start" : t === 1 ? "end" : "middle"} fontSize={9.5} fill="#6b7282">
              {t * 100}%
            </text>
          ))}
          {p.value !== null ? (
            <>
              <rect x={8} y={9} width={x(p.value) - 8} height={8} rx={4} fill={colour} opacity={0.28} />
              {p.ci95 ? <line x1={x(p.ci95.lower)} x2={x(p.ci95.upper)} y1={13} y2={13} stroke={colour} strokeWidth={3} strokeLinecap="round" /> : null}
              <circle cx={x(p.value)} cy={13} r={6} fill="#fffdf8" stroke={colour} strokeWidth={2.5} />
            </>
          ) : null}
        </svg>
        <p className="num text-xs text-ink-soft">{describeProportion(p)}</p>
      </div>
    </div>
  );
}

/** Take-rate, and how good the suggestions are: honestly on blind labels, flattered on shown ones. */
export function SuggestionPanel({ report, counts }: { report: ReportView; counts: SuggestionCounts }) {
  const s = report.suggestions;
  if (!s || report.ratings === 0) return <p className="text-sm text-ink-soft">No labels yet.</p>;
  if (counts.shown + counts.hidden === 0) {
    return <p className="text-sm text-ink-soft">No label has been given with a suggestion yet, shown or hidden: the suggestion figures appear once the engine has enough labelled neighbours to propose classes.</p>;
  }
  return (
    <div className="space-y-5">
      <Notice tone="caution" title="Suggestions anchor judgement">
        People who see a suggestion tend to take it, so on labels given with the suggestion on screen both the suggestion&apos;s
        accuracy and the agreement between annotators look better than they are. Only <strong>blind</strong> items, labelled with the suggestion
        hidden, measure the suggestion honestly.
      </Notice>
      <dl className="grid gap-3 sm:grid-cols-3">
        <div className="rounded-md border border-line bg-paper p-3">
          <dt className="text-xs font-bold uppercase tracking-[0.1em] text-ink-faint">Take-rate</dt>
          <dd className="num mt-1 text-2xl font-extrabold text-ink">{pct(s.takeRate.value)}</dd>
          <dd className="num text-xs text-ink-soft">{describeProportion(s.takeRate)} of labels with the suggestion on screen</dd>
        </div>
        <div className="rounded-md border border-line bg-paper p-3">
          <dt className="text-xs font-bold uppercase tracking-[0.1em] text-ink-faint">Suggestion shown</dt>
          <dd className="num mt-1 text-2xl font-extrabold text-ink">{counts.shown.toLocaleString("en")}</dd>
          <dd className="text-xs text-ink-soft">labels</dd>
        </div>
        <div className="rounded-md border border-line bg-paper p-3">
          <dt className="text-xs font-bold uppercase tracking-[0.1em] text-ink-faint">Suggestion hidden</dt>
          <dd className="num mt-1 text-2xl font-extrabold text-ink">{counts.hidden.toLocaleString("en")}</dd>
          <dd className="text-xs text-ink-soft">blind labels{counts.none ? `; ${counts.none.toLocaleString("en")} more had no suggestion to make` : ""}</dd>
        </div>
      </dl>
      <div className="space-y-3">
        <h3 className="text-sm font-bold text-ink">Suggestion&apos;s top class equals the final label</h3>
        <ShareBar label="Blind items (honest)" p={s.blind.topClassAccuracy} tone="blind" />
        <ShareBar label="Shown items (anchored)" p={s.shown.topClassAccuracy} tone="shown" />
      </div>
      <div className="space-y-3">
        <h3 className="text-sm font-bold text-ink">Annotator&apos;s label equals the suggestion&apos;s top class</h3>
        <ShareBar label="Suggestion hidden" p={s.blind.labelMatchesTop} tone="blind" />
        <ShareBar label="Suggestion shown" p={s.shown.labelMatchesTop} tone="shown" />
        <p className="text-xs text-ink-faint">The gap between these two is how far seeing the suggestion moves people.</p>
      </div>
      <table className="sr-only">
        <caption>Suggestion accuracy and label match, blind versus shown labels, with Wilson 95% intervals</caption>
        <thead>
          <tr><th scope="col">Measure</th><th scope="col">Blind</th><th scope="col">Shown</th></tr>
        </thead>
        <tbody>
          <tr><th scope="row">Top class equals final label</th><td>{describeProportion(s.blind.topClassAccuracy)}</td><td>{describeProportion(s.shown.topClassAccuracy)}</td></tr>
          <tr><th scope="row">Label equals top class</th><td>{describeProportion(s.blind.labelMatchesTop)}</td><td>{describeProportion(s.shown.labelMatchesTop)}</td></tr>
        </tbody>
      </table>
    </div>
  );
}
