"use client";

import { Select } from "@/components/ui/field";
import type { TablePreview } from "@/lib/imports/preview";
import type { ColumnRole, RoleMapping } from "@/lib/imports/types";

const roleNames: Record<ColumnRole, string> = {
  id: "Id (external id)",
  numeric: "Numeric feature",
  categorical: "Categorical feature",
  vector: "Vector (array of numbers)",
  text: "Text (shown, not a feature)",
  prior_label: "Prior label",
  ignore: "Ignore",
};

export function mappingFromPreview(table: TablePreview): RoleMapping {
  return table.columns.map((c) => ({ name: c.name, role: c.detected, width: c.width }));
}

/** The detected role of each column, for the owner to confirm or change; the first rows below. */
export function RoleMapper({ table, mapping, onChange, roles = Object.keys(roleNames) as ColumnRole[] }: { table: TablePreview; mapping: RoleMapping; onChange: (m: RoleMapping) => void; roles?: ColumnRole[] }) {
  const set = (i: number, patch: Partial<RoleMapping[number]>) => onChange(mapping.map((m, j) => (j === i ? { ...m, ...patch } : m)));
  return (
    <div className="space-y-5">
      <div className="overflow-x-auto rounded-md border border-line">
        <table className="w-full text-left text-sm">
          <thead className="bg-paper-sunk text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th className="px-3 py-2">Column</th>
              <th className="px-3 py-2">Examples</th>
              <th className="px-3 py-2">Role</th>
            </tr>
          </thead>
          <tbody>
            {table.columns.map((c, i) => (
              <tr key={c.name} className="border-t border-line align-top">
                <td className="px-3 py-2 font-mono text-xs font-semibold text-ink">
                  {c.name}
                  <div className="font-sans font-normal text-ink-faint">
                    {c.distinct} distinct{c.empty ? ` · ${c.empty} empty` : ""} in {table.sampled} rows
                  </div>
                </td>
                <td className="max-w-xs truncate px-3 py-2 text-xs text-ink-soft">{c.samples.join(" · ")}</td>
                <td className="px-3 py-2">
                  <div className="flex items-center gap-2">
                    <Select aria-label={`Role of ${c.name}`} value={mapping[i]?.role ?? "ignore"} onChange={(e) => set(i, { role: e.target.value as ColumnRole })} className="min-w-52">
                      {roles.map((r) => (
                        <option key={r} value={r}>
                          {roleNames[r]}
                        </option>
                      ))}
                    </Select>
                    {mapping[i]?.role === "vector" ? (
                      <input
                        aria-label={`Length of ${c.name}`}
                        type="number"
                        min={1}
                        className="w-24 rounded-md border border-line bg-paper-raised px-2 py-2 text-sm"
                        value={mapping[i]?.width ?? ""}
                        onChange={(e) => set(i, { width: Number(e.target.value) || undefined })}
                      />
                    ) : null}
                  </div>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div>
        <p className="mb-2 text-xs font-bold uppercase tracking-wide text-ink-soft">First rows of {table.fileName}</p>
        <div className="overflow-x-auto rounded-md border border-line">
          <table className="w-full text-left font-mono text-xs">
            <thead className="bg-paper-sunk text-ink-soft">
              <tr>
                <th className="px-2 py-1.5 font-sans">#</th>
                {table.columns.map((c) => (
                  <th key={c.name} className="whitespace-nowrap px-2 py-1.5">
                    {c.name}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {table.rows.map((r, i) => (
                <tr key={i} className="border-t border-line">
                  <td className="px-2 py-1 text-ink-faint">{i + 1}</td>
                  {r.map((v, j) => (
                    <td key={j} className="max-w-[16rem] truncate whitespace-nowrap px-2 py-1 text-ink">
                      {v}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </div>
    </div>
  );
}
