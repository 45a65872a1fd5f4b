import { InlineText } from "./inline-text";
import type { FieldRow } from "./schema-text";

export function FieldTable({ rows, caption }: { rows: FieldRow[]; caption: string }) {
  if (!rows.length) return null;
  return (
    <table className="w-full border-collapse text-left text-sm">
      <caption className="sr-only">{caption}</caption>
      <thead>
        <tr className="border-b border-line text-xs uppercase tracking-[0.06em] text-ink-faint">
          <th scope="col" className="py-1.5 pr-3 font-semibold">Field</th>
          <th scope="col" className="py-1.5 pr-3 font-semibold">Type</th>
          <th scope="col" className="py-1.5 font-semibold">Notes</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.path} className="border-b border-line/60 align-top last:border-0">
            <td className="py-1.5 pr-3 font-mono text-[0.82rem] text-ink">
              {r.path}
              {r.required ? <span className="ml-1 text-xs font-sans font-bold text-amber-700" title="required">required</span> : null}
            </td>
            <td className="py-1.5 pr-3 font-mono text-[0.8rem] text-pine-700">{r.type}</td>
            <td className="py-1.5 text-ink-soft">
              {r.description ? <InlineText text={r.description} /> : null}
              {r.notes.length ? <span className="block text-xs text-ink-faint">{r.notes.join(" · ")}</span> : null}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
