"use client";

import { Input, Select } from "@/components/ui/field";
import type { ClassInfo, Filters } from "./types";

/** Status, label, vote share range, id search and sort for the items table. */
export function ItemFilters({ value, onChange, classes }: { value: Filters; onChange: (f: Filters) => void; classes: ClassInfo[] }) {
  const set = (p: Partial<Filters>) => onChange({ ...value, ...p });
  return (
    <div className="grid gap-3 sm:grid-cols-3 lg:grid-cols-6" role="search">
      <Input aria-label="Search ids" placeholder="Search ids…" value={value.q} onChange={(e) => set({ q: e.target.value })} className="lg:col-span-2" />
      <Select aria-label="Status" value={value.status} onChange={(e) => set({ status: e.target.value })}>
        <option value="">Any status</option>
        <option value="unlabelled">Unlabelled</option>
        <option value="in_progress">In progress</option>
        <option value="labelled">Labelled</option>
        <option value="disputed">Disputed</option>
        <option value="control">Control items</option>
      </Select>
      <Select aria-label="Label" value={value.label} onChange={(e) => set({ label: e.target.value })}>
        <option value="">Any label</option>
        {classes.map((c) => (
          <option key={c.id} value={String(c.id)}>
            {c.name}
          </option>
        ))}
      </Select>
      <div className="flex items-center gap-1.5 text-xs text-ink-soft" title="Top vote share range (0–1)">
        <Input aria-label="Lowest top vote share" type="number" min={0} max={1} step={0.05} placeholder="min" value={value.shareMin} onChange={(e) => set({ shareMin: e.target.value })} />
        <Input aria-label="Highest top vote share" type="number" min={0} max={1} step={0.05} placeholder="max" value={value.shareMax} onChange={(e) => set({ shareMax: e.target.value })} />
      </div>
      <Select aria-label="Sort" value={`${value.sort}:${value.dir}`} onChange={(e) => {
        const [sort, dir] = e.target.value.split(":");
        set({ sort, dir: dir as "asc" | "desc" });
      }}>
        <option value="seq:asc">Import order</option>
        <option value="seq:desc">Newest first</option>
        <option value="external_id:asc">Id A→Z</option>
        <option value="external_id:desc">Id Z→A</option>
        <option value="top_share:asc">Top vote share, low first</option>
        <option value="top_share:desc">Top vote share, high first</option>
      </Select>
    </div>
  );
}
