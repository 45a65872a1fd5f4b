"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Input } from "@/components/ui/field";
import { ApiError, apiFetch } from "@/lib/client/api";
import { type IncludeSource, includeSources } from "@/lib/editions/options";
import { type EditionSummary, editionsUrl, sourceNames } from "./api";

const hints: Record<IncludeSource, string> = {
  agreed: "annotators gave the same label",
  ruling: "a reviewer ruled on a disagreement",
  single: "one label was enough (overlap 1)",
  control: "items with a known label",
  disputed: "waiting for a ruling: no final label",
};

/** The owner's form: which items, an optional stratified split, and how annotators are named. */
export function PublishForm({ projectId, nextNumber, onPublished }: { projectId: number; nextNumber: number; onPublished: (e: EditionSummary) => void }) {
  const [include, setInclude] = useState<IncludeSource[]>(["agreed", "ruling", "single", "control"]);
  const [split, setSplit] = useState(false);
  const [seed, setSeed] = useState("1");
  const [parts, setParts] = useState({ train: "70", validation: "15", test: "15" });
  const [identity, setIdentity] = useState<"id" | "email">("id");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  const toggle = (s: IncludeSource) => setInclude((list) => (list.includes(s) ? list.filter((x) => x !== s) : [...list, s]));
  const total = Number(parts.train) + Number(parts.validation) + Number(parts.test);

  async function publish() {
    setBusy(true);
    setError(null);
    try {
      const body = {
        include,
        annotatorIdentity: identity,
        split: split ? { seed: Number(seed), train: Number(parts.train) / 100, validation: Number(parts.validation) / 100, test: Number(parts.test) / 100 } : null,
      };
      const res = await apiFetch<{ data: EditionSummary }>(editionsUrl(projectId), { body });
      onPublished(res.data);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "Publishing failed; try again.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <form className="space-y-5" onSubmit={(e) => { e.preventDefault(); void publish(); }}>
      <fieldset>
        <legend className="text-sm font-semibold text-ink">Items to include</legend>
        <div className="mt-2 grid gap-2 sm:grid-cols-2">
          {includeSources.map((s) => (
            <label key={s} className="flex items-start gap-2 text-sm">
              <input type="checkbox" className="mt-1 accent-pine-600" checked={include.includes(s)} onChange={() => toggle(s)} />
              <span>
                <span className="font-semibold text-ink">{sourceNames[s]}</span> <span className="text-ink-faint">— {hints[s]}</span>
              </span>
            </label>
          ))}
        </div>
      </fieldset>
      <fieldset className="space-y-2">
        <label className="flex items-center gap-2 text-sm font-semibold text-ink">
          <input type="checkbox" className="accent-pine-600" checked={split} onChange={(e) => setSplit(e.target.checked)} />
          Add a train / validation / test split (stratified by label)
        </label>
        {split ? (
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
            {(["train", "validation", "test"] as const).map((k) => (
              <label key={k} className="text-xs font-semibold capitalize text-ink-soft">
                {k} %
                <Input type="number" min={0} max={100} step={1} value={parts[k]} onChange={(e) => setParts({ ...parts, [k]: e.target.value })} aria-label={`${k} percent`} />
              </label>
            ))}
            <label className="text-xs font-semibold text-ink-soft">
              Seed
              <Input type="number" min={0} step={1} value={seed} onChange={(e) => setSeed(e.target.value)} aria-label="Split seed" />
            </label>
            {Math.abs(total - 100) > 1e-9 ? <p className="col-span-full text-sm text-alarm-700">The parts add up to {total}%, not 100%.</p> : null}
          </div>
        ) : null}
      </fieldset>
      <fieldset>
        <legend className="text-sm font-semibold text-ink">Name annotators by</legend>
        <div className="mt-2 flex flex-wrap gap-4 text-sm">
          <label className="flex items-center gap-2">
            <input type="radio" name="identity" className="accent-pine-600" checked={identity === "id"} onChange={() => setIdentity("id")} /> user id (pseudonymous)
          </label>
          <label className="flex items-center gap-2">
            <input type="radio" name="identity" className="accent-pine-600" checked={identity === "email"} onChange={() => setIdentity("email")} /> e-mail address
          </label>
        </div>
        {identity === "email" ? <p className="mt-1 text-xs text-amber-700">E-mail addresses are personal data: everyone who receives the files will see who labelled what.</p> : null}
      </fieldset>
      {error ? <p role="alert" className="text-sm font-medium text-alarm-700">{error}</p> : null}
      <Button type="submit" disabled={busy || include.length === 0 || (split && Math.abs(total - 100) > 1e-9)}>
        {busy ? "Publishing…" : `Publish edition ${nextNumber}`}
      </Button>
    </form>
  );
}
