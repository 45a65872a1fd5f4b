import Link from "next/link";
import { Card, EmptyState, Notice } from "@/components/ui/card";
import type { AgreementView } from "@/lib/agreement-server";
import { ClassTable, AnnotatorTable } from "./tables";
import { Headline } from "./headline";
import { IntervalChart, type IntervalRow } from "./interval-chart";
import { KappaMatrix } from "./kappa-matrix";
import { SuggestionPanel } from "./suggestion-panel";
import { CoefficientTable } from "./coefficient-table";

export type Scope = "all" | "blind";

type Ready = NonNullable<AgreementView["report"]>;

function ScopeTabs({ base, scope, blindItems }: { base: string; scope: Scope; blindItems: number }) {
  const tab = (s: Scope, label: string) => (
    <Link
      href={s === "all" ? base : `${base}?scope=blind`}
      aria-current={scope === s ? "page" : undefined}
      className={`rounded-md px-3 py-1.5 text-sm font-semibold ${scope === s ? "bg-ink text-paper-raised" : "text-ink-soft hover:bg-paper-sunk"}`}
    >
      {label}
    </Link>
  );
  return (
    <nav aria-label="Which labels" className="inline-flex gap-1 rounded-lg border border-line bg-paper-raised p-1">
      {tab("all", "All labels")}
      {tab("blind", `Blind items only (${blindItems.toLocaleString("en")})`)}
    </nav>
  );
}

/** The Agreement page's body: headline figures, intervals, pairs, classes, annotators, suggestions. */
export function AgreementReportView({ data, scope, base }: { data: Ready; scope: Scope; base: string }) {
  const r = scope === "blind" ? data.blind : data.overall;
  const tooFew = r.pairableItems === 0;
  const rows: IntervalRow[] = [
    { key: "alpha", label: "Krippendorff's α", value: r.krippendorffAlpha.value, ci95: r.krippendorffAlpha.ci95 },
    { key: "fleiss", label: "Fleiss' κ", value: r.fleissKappa.value, ci95: r.fleissKappa.ci95 },
    ...r.perClass.map((c) => ({ key: `class-${c.class.index}`, label: `α · ${c.class.name}`, value: c.alpha.value, ci95: c.alpha.ci95 })),
    ...r.perAnnotator.map((a) => ({ key: `ann-${a.annotator.index}`, label: `κ · ${a.annotator.name}${a.annotator.you ? " (you)" : ""}`, value: a.kappaVsOthers.value, ci95: a.kappaVsOthers.ci95 })),
  ];
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <ScopeTabs base={base} scope={scope} blindItems={data.blindItems} />
        <p className="num text-xs text-ink-faint">
          {r.ratings.toLocaleString("en")} labels · {r.items.toLocaleString("en")} items · {r.pairableItems.toLocaleString("en")} with two or more labels · {r.annotators} annotators
        </p>
      </div>
      {scope === "blind" ? (
        <Notice>These figures use only items labelled with the suggestion hidden, so no one was anchored by it. Fewer items: wider intervals.</Notice>
      ) : null}
      {tooFew ? (
        <EmptyState title="Too few overlapping labels yet">
          Agreement needs items labelled by at least two annotators. {r.ratings ? `So far ${r.ratings.toLocaleString("en")} labels, none of them on a shared item.` : "No labels here yet."}{" "}
          Raise the project&apos;s overlap or let more annotators work through the queue.
        </EmptyState>
      ) : (
        <>
          <Headline report={r} />
          <Notice title="Read a coefficient with its interval">
            A coefficient without its 95% interval is not to be read alone: on a few dozen items κ = 0.62 may be anything from fair to almost perfect.
            Compare annotators or classes only where their intervals do not overlap. Bands after Landis &amp; Koch (1977); each interval comes from{" "}
            {r.bootstrap.resamples.toLocaleString("en")} bootstrap resamples over items (seed {r.bootstrap.seed}).
          </Notice>
          <Card title="Coefficients and their 95% intervals">
            <IntervalChart rows={rows} title="Agreement coefficients with bootstrap 95% intervals over the Landis and Koch bands" />
            <details className="mt-4">
              <summary className="cursor-pointer text-sm font-semibold text-pine-700">The same numbers as a table</summary>
              <div className="mt-3"><CoefficientTable report={r} /></div>
            </details>
          </Card>
          <Card title="Annotator pairs (Cohen's kappa)">
            {r.cohenKappa.length ? <KappaMatrix pairs={r.cohenKappa} annotators={data.annotators} /> : <p className="text-sm text-ink-soft">No two annotators share an item yet.</p>}
            <p className="mt-3 text-xs text-ink-faint">n: items both annotators labelled. Pairs with small n have wide intervals; pairs with different class shares are not comparable.</p>
          </Card>
          <Card title="Per class (one vs rest)">
            <ClassTable rows={r.perClass} />
          </Card>
        </>
      )}
      {r.perAnnotator.length ? (
        <Card title="Per annotator">
          <AnnotatorTable rows={r.perAnnotator} />
          <p className="mt-3 text-xs text-ink-faint">
            Final labels are built from these very labels, so matching them flatters whoever voted with the majority. Control items, whose class the
            owner knows, are the independent check. {data.overall.control.total === 0 ? "This project has no labelled control items yet." : ""}
          </p>
        </Card>
      ) : null}
      <Card title="Suggestions">
        {scope === "all" ? (
          <SuggestionPanel report={r} counts={data.suggestionCounts} />
        ) : (
          <p className="text-sm text-ink-soft">
            Suggestion figures, including the suggestion&apos;s accuracy on these blind items next to shown ones, are under{" "}
            <Link href={base} className="font-semibold text-pine-700 underline">All labels</Link>.
          </p>
        )}
      </Card>
    </div>
  );
}
