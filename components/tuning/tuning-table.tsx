"use client";

import type { TuningResult } from "@/lib/knn";
import { distanceLook, pct } from "./types";

/** Every (k, distance) result as numbers; a row is selectable to read its reliability table. */
export function TuningTable({ results, selected, onSelect }: { results: TuningResult[]; selected: { k: number; distance: string }; onSelect: (k: number, distance: string) => void }) {
  const best = results.reduce((b, r) => (r.accuracy > b.accuracy || (r.accuracy === b.accuracy && r.logLoss < b.logLoss) ? r : b), results[0]);
  return (
    <div className="max-h-96 overflow-auto rounded-md border border-line">
      <table className="w-full text-sm">
        <caption className="sr-only">Leave-one-out results for every k and distance</caption>
        <thead className="sticky top-0 bg-paper-sunk text-left text-xs uppercase tracking-[0.08em] text-ink-soft">
          <tr>
            <th scope="col" className="px-3 py-2">k</th>
            <th scope="col" className="px-3 py-2">Distance</th>
            <th scope="col" className="px-3 py-2 text-right">Accuracy</th>
            <th scope="col" className="whitespace-nowrap px-3 py-2 text-right">Correct / n</th>
            <th scope="col" className="whitespace-nowrap px-3 py-2 text-right">Macro-F1</th>
            <th scope="col" className="whitespace-nowrap px-3 py-2 text-right">Log-loss</th>
            <th scope="col" className="px-3 py-2 text-right">ECE</th>
            <th scope="col" className="px-3 py-2"><span className="sr-only">Select</span></th>
          </tr>
        </thead>
        <tbody>
          {results.map((r) => {
            const on = r.k === selected.k && r.distance === selected.distance;
            return (
              <tr key={`${r.distance}-${r.k}`} className={`border-t border-line ${on ? "bg-amber-50" : "hover:bg-paper"}`}>
                <td className="num px-3 py-1.5">{r.k}</td>
                <td className="whitespace-nowrap px-3 py-1.5">
                  <span className="inline-block h-2 w-2 rounded-full align-middle" style={{ background: distanceLook[r.distance].colour }} aria-hidden="true" /> {distanceLook[r.distance].label}
                  {r === best ? <span className="ml-1.5 rounded bg-pine-50 px-1.5 text-[11px] font-bold text-pine-700" title="Highest accuracy (ties: lower log-loss)">best</span> : null}
                </td>
                <td className="num px-2 py-1.5 text-right">{pct(r.accuracy)}</td>
                <td className="num whitespace-nowrap px-3 py-1.5 text-right text-ink-soft">{r.correct} / {r.n}</td>
                <td className="num px-2 py-1.5 text-right">{r.macroF1.toFixed(3)}</td>
                <td className="num px-2 py-1.5 text-right">{r.logLoss.toFixed(3)}</td>
                <td className="num px-2 py-1.5 text-right">{r.reliability.ece.toFixed(3)}</td>
                <td className="px-3 py-1.5 text-right">
                  <button type="button" onClick={() => onSelect(r.k, r.distance)} aria-pressed={on} className="rounded px-2 py-0.5 text-xs font-semibold text-pine-700 hover:bg-pine-50">
                    {on ? "Selected" : "Select"}
                  </button>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

/** Vote-share bins → observed accuracy, with a bar comparing the two, and the expected calibration error. */
export function ReliabilityTable({ result }: { result: TuningResult }) {
  const { bins, ece } = result.reliability;
  return (
    <div>
      <table className="w-full text-sm">
        <caption className="mb-2 text-left text-sm text-ink-soft">
          k = {result.k}, {distanceLook[result.distance].label}: when the top class gets a vote share in a bin, how often is it right? ECE ={" "}
          <span className="num font-bold text-ink">{ece.toFixed(3)}</span> (Σ count/n × |accuracy − mean share|).
        </caption>
        <thead className="text-left text-xs uppercase tracking-[0.08em] text-ink-soft">
          <tr>
            <th scope="col" className="py-1.5 pr-3">Top share</th>
            <th scope="col" className="py-1.5 pr-3 text-right">Items</th>
            <th scope="col" className="py-1.5 pr-3 text-right">Mean share</th>
            <th scope="col" className="py-1.5 pr-3 text-right">Accuracy</th>
            <th scope="col" className="py-1.5 w-1/3"><span className="sr-only">Comparison</span></th>
          </tr>
        </thead>
        <tbody>
          {bins.map((b) => (
            <tr key={b.lower} className="border-t border-line">
              <td className="num whitespace-nowrap py-1.5 pr-3">{b.lower.toFixed(1)}–{b.upper.toFixed(1)}</td>
              <td className="num py-1.5 pr-3 text-right">{b.count}</td>
              <td className="num py-1.5 pr-3 text-right">{pct(b.meanTopShare)}</td>
              <td className="num py-1.5 pr-3 text-right">{pct(b.accuracy)}</td>
              <td className="py-1.5" aria-hidden="true">
                {b.count > 0 ? (
                  <div className="relative h-3 rounded-sm bg-paper-sunk">
                    <div className="absolute inset-y-0 left-0 rounded-sm bg-pine-500/70" style={{ width: `${100 * (b.accuracy ?? 0)}%` }} />
                    <div className="absolute inset-y-[-2px] w-0.5 bg-amber-700" style={{ left: `${100 * (b.meanTopShare ?? 0)}%` }} />
                  </div>
                ) : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-2 text-xs text-ink-faint">Bar: observed accuracy; tick: mean vote share. A well-calibrated bin has the tick at the bar&apos;s end.</p>
    </div>
  );
}
