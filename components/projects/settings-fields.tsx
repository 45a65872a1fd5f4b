"use client";

import { Field, Input, Select } from "@/components/ui/field";
import type { ProjectSettings } from "@/lib/projects/settings";

export type SettingsDraft = Pick<ProjectSettings, "overlap" | "blindShare" | "controlRate" | "k" | "distance" | "scaling" | "weighting" | "queueOrder" | "missingValues" | "disputeDigestThreshold">;

const pct = (v: number) => Math.round(v * 100);

/** The project settings a person tunes, with the reason for each beside it. */
export function SettingsFields({ value, onChange, errors }: { value: SettingsDraft; onChange: (v: SettingsDraft) => void; errors: Record<string, string> }) {
  const set = <K extends keyof SettingsDraft>(k: K, v: SettingsDraft[K]) => onChange({ ...value, [k]: v });
  return (
    <div className="grid gap-4 md:grid-cols-2">
      <Field label="Overlap (labels per item)" htmlFor="overlap" error={errors["settings.overlap"]} hint="1–5 distinct annotators label each item; 2 or more lets Vicinal measure agreement.">
        <Input id="overlap" type="number" min={1} max={5} value={value.overlap} onChange={(e) => set("overlap", Number(e.target.value))} />
      </Field>
      <Field label="Blind share (%)" htmlFor="blindShare" error={errors["settings.blindShare"]} hint="Items labelled without a suggestion, to measure anchoring and suggestion accuracy honestly.">
        <Input id="blindShare" type="number" min={0} max={100} value={pct(value.blindShare)} onChange={(e) => set("blindShare", Number(e.target.value) / 100)} />
      </Field>
      <Field label="Control items (%)" htmlFor="controlRate" error={errors["settings.controlRate"]} hint="Share of the Desk queue drawn from items with a known label.">
        <Input id="controlRate" type="number" min={0} max={100} value={pct(value.controlRate)} onChange={(e) => set("controlRate", Number(e.target.value) / 100)} />
      </Field>
      <Field label="k (neighbours that vote)" htmlFor="k" error={errors["settings.k"]} hint="Small k follows local detail; large k smooths. Tuning shows the curve.">
        <Input id="k" type="number" min={1} max={101} value={value.k} onChange={(e) => set("k", Number(e.target.value))} />
      </Field>
      <Field label="Distance" htmlFor="distance" error={errors["settings.distance"]} hint="Euclidean suits measurements; cosine suits embeddings.">
        <Select id="distance" value={value.distance} onChange={(e) => set("distance", e.target.value as SettingsDraft["distance"])}>
          <option value="euclidean">Euclidean</option>
          <option value="manhattan">Manhattan</option>
          <option value="cosine">Cosine</option>
        </Select>
      </Field>
      <Field label="Feature scaling" htmlFor="scaling" error={errors["settings.scaling"]} hint="Without scaling, the column with the largest range dominates distances.">
        <Select id="scaling" value={value.scaling} onChange={(e) => set("scaling", e.target.value as SettingsDraft["scaling"])}>
          <option value="zscore">Standardise (z-score)</option>
          <option value="minmax">Min–max to [0, 1]</option>
          <option value="none">None</option>
        </Select>
      </Field>
      <Field label="Vote weighting" htmlFor="weighting" error={errors["settings.weighting"]}>
        <Select id="weighting" value={value.weighting} onChange={(e) => set("weighting", e.target.value as SettingsDraft["weighting"])}>
          <option value="uniform">One vote per neighbour</option>
          <option value="inverse">Weighted by 1 / distance</option>
        </Select>
      </Field>
      <Field label="Desk order" htmlFor="queueOrder" error={errors["settings.queueOrder"]} hint="Which unlabelled items annotators see first.">
        <Select id="queueOrder" value={value.queueOrder} onChange={(e) => set("queueOrder", e.target.value as SettingsDraft["queueOrder"])}>
          <option value="least_confident">Least confident suggestion first</option>
          <option value="smallest_margin">Smallest margin between top two classes</option>
          <option value="highest_entropy">Most split vote (entropy) first</option>
          <option value="random">Random</option>
          <option value="import_order">Import order</option>
        </Select>
      </Field>
      <Field label="Missing numbers on import" htmlFor="missingValues" error={errors["settings.missingValues"]}>
        <Select id="missingValues" value={value.missingValues} onChange={(e) => set("missingValues", e.target.value as SettingsDraft["missingValues"])}>
          <option value="reject">Reject the file, listing each cell</option>
          <option value="missing">Keep the row; treat the value as missing</option>
        </Select>
      </Field>
      <Field label="Dispute digest after" htmlFor="disputeDigestThreshold" error={errors["settings.disputeDigestThreshold"]} hint="Reviewers get an e-mail when this many disputes are open.">
        <Input id="disputeDigestThreshold" type="number" min={1} value={value.disputeDigestThreshold} onChange={(e) => set("disputeDigestThreshold", Number(e.target.value))} />
      </Field>
    </div>
  );
}
