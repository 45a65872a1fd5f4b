"use client";

import type { EditionManifest } from "@/lib/editions/manifest";
import { formatBytes, sourceNames, when } from "./api";

const num = (n: number) => n.toLocaleString("en");
const coef = (v: number | null | undefined) => (v === null || v === undefined ? "—" : v.toFixed(3));

function Dl({ rows }: { rows: Array<[string, React.ReactNode]> }) {
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
      {rows.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="text-ink-soft">{k}</dt>
          <dd className="font-medium text-ink">{v}</dd>
        </div>
      ))}
    </dl>
  );
}

/** What a published edition holds: counts by label, source and split, the settings and figures in force, and file hashes. */
export function ManifestView({ m }: { m: EditionManifest }) {
  const split = m.counts.bySplit;
  const a = m.agreement;
  return (
    <div className="space-y-5">
      <div className="grid gap-5 lg:grid-cols-2">
        <section>
          <h3 className="mb-2 text-xs font-bold uppercase tracking-[0.08em] text-ink-soft">Rows by label</h3>
          <table className="w-full text-sm">
            <thead className="text-xs text-ink-soft">
              <tr>
                <th className="text-left font-semibold">Label</th>
                <th className="text-right font-semibold">Rows</th>
                {split ? ["train", "validation", "test"].map((s) => <th key={s} className="text-right font-semibold capitalize">{s}</th>) : null}
              </tr>
            </thead>
            <tbody>
              {m.classes.map((c) => (
                <tr key={c.id} className="border-t border-line">
                  <td className="py-1">
                    <span className="mr-2 inline-block h-2.5 w-2.5 rounded-full align-middle" style={{ background: c.colour }} aria-hidden="true" />
                    {c.name}
                  </td>
                  <td className="text-right tabular-nums">{num(m.counts.byClass[c.name] ?? 0)}</td>
                  {split ? (["train", "validation", "test"] as const).map((s) => <td key={s} className="text-right tabular-nums text-ink-soft">{num(split[s].byClass[c.name] ?? 0)}</td>) : null}
                </tr>
              ))}
              {m.counts.bySource.disputed ? (
                <tr className="border-t border-line text-ink-soft">
                  <td className="py-1">no final label (disputed)</td>
                  <td className="text-right tabular-nums">{num(m.counts.bySource.disputed)}</td>
                </tr>
              ) : null}
              <tr className="border-t-2 border-line-strong font-bold">
                <td className="py-1">All</td>
                <td className="text-right tabular-nums">{num(m.counts.rows)}</td>
                {split ? (["train", "validation", "test"] as const).map((s) => <td key={s} className="text-right tabular-nums">{num(split[s].rows)}</td>) : null}
              </tr>
            </tbody>
          </table>
        </section>
        <section>
          <h3 className="mb-2 text-xs font-bold uppercase tracking-[0.08em] text-ink-soft">Rows by label source</h3>
          <Dl rows={Object.entries(m.counts.bySource).filter(([k, n]) => n > 0 || m.options.include.includes(k as never)).map(([k, n]) => [sourceNames[k] ?? k, num(n)])} />
          <p className="mt-2 text-xs text-ink-faint">
            {num(m.counts.blind)} blind, {num(m.counts.control)} control items; {num(m.counts.annotators)} annotators named by {m.annotatorIdentity === "email" ? "e-mail address" : "user id"}.
          </p>
        </section>
      </div>
      <div className="grid gap-5 lg:grid-cols-2">
        <section>
          <h3 className="mb-2 text-xs font-bold uppercase tracking-[0.08em] text-ink-soft">Frozen with</h3>
          <Dl
            rows={[
              ["Snapshot", when(m.snapshotAt)],
              ["k-NN", `k = ${String(m.knn.k)}, ${String(m.knn.distance)} distance, ${String(m.knn.scaling)} scaling, ${String(m.knn.weighting)} votes`],
              ["Split", m.split ? `${m.split.fractions.train * 100}/${m.split.fractions.validation * 100}/${m.split.fractions.test * 100}, seed ${m.split.seed}` : "none"],
              ["Features", m.featureColumns.length ? m.featureColumns.map((c) => c.column.replace(/^feature:/, "")).join(", ") : "none"],
            ]}
          />
        </section>
        <section>
          <h3 className="mb-2 text-xs font-bold uppercase tracking-[0.08em] text-ink-soft">Agreement at the snapshot</h3>
          {a ? (
            <Dl
              rows={[
                ["Krippendorff's α", `${coef(a.krippendorffAlpha.value)}${a.krippendorffAlpha.ci95 ? ` (95% CI ${coef(a.krippendorffAlpha.ci95.lower)}–${coef(a.krippendorffAlpha.ci95.upper)})` : ""}`],
                ["Reading", a.band ? `${a.band} (Landis & Koch)` : "—"],
                ["Fleiss' κ", coef(a.fleissKappa.value)],
                ["Blind labels α", `${coef(a.blind.krippendorffAlpha.value)} over ${num(a.blind.ratings)} labels`],
                ["From", `${num(a.labels)} labels on ${num(a.items)} items`],
              ]}
            />
          ) : (
            <p className="text-sm text-ink-soft">No labels to measure yet.</p>
          )}
        </section>
      </div>
      <section>
        <h3 className="mb-2 text-xs font-bold uppercase tracking-[0.08em] text-ink-soft">Files</h3>
        <table className="w-full text-sm">
          <tbody>
            {(["csv", "parquet", "jsonl"] as const).map((f) => (
              <tr key={f} className="border-t border-line">
                <td className="py-1 font-medium">{m.files[f].name}</td>
                <td className="text-right tabular-nums text-ink-soft">{formatBytes(m.files[f].bytes)}</td>
                <td className="pl-4">
                  <code className="break-all font-mono text-[11px] text-ink-soft" title="SHA-256">sha256 {m.files[f].sha256}</code>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
    </div>
  );
}
