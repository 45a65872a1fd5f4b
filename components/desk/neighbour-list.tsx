import { fieldTitle, formatDistance, formatNumber } from "./format";
import type { DeskClass, DeskColumn, DeskNeighbour } from "./types";

/**
 * A neighbour's compact view: one small column per numeric field, drawn above the mid-line when the neighbour's
 * value is higher than this item's and below when lower, scaled by the field's spread among the item and its neighbours.
 */
function DiffStrip({ item, neighbour, columns, spread }: { item: Record<string, unknown>; neighbour: Record<string, unknown>; columns: DeskColumn[]; spread: Map<string, number> }) {
  const w = 7;
  const h = 22;
  return (
    <svg width={columns.length * (w + 2)} height={h} aria-hidden="true" className="shrink-0">
      <line x1={0} x2={columns.length * (w + 2)} y1={h / 2} y2={h / 2} stroke="#d9d3c7" />
      {columns.map((col, i) => {
        const a = item[col.name];
        const b = neighbour[col.name];
        if (typeof a !== "number" || typeof b !== "number") return <rect key={col.name} x={i * (w + 2)} y={h / 2 - 1} width={w} height={2} fill="#b9b1a2" />;
        const s = spread.get(col.name) || 1;
        const d = Math.max(-1, Math.min(1, (b - a) / s));
        const bh = Math.max(1.5, Math.abs(d) * (h / 2 - 1));
        return <rect key={col.name} x={i * (w + 2)} y={d >= 0 ? h / 2 - bh : h / 2} width={w} height={bh} rx={1} fill={d >= 0 ? "#2b7a73" : "#d9a441"} />;
      })}
    </svg>
  );
}

export function NeighbourList({ neighbours, classes, columns, itemFields }: { neighbours: DeskNeighbour[]; classes: DeskClass[]; columns: DeskColumn[]; itemFields: Record<string, unknown> }) {
  const byId = new Map(classes.map((c) => [c.id, c]));
  const numeric = columns.filter((c) => c.kind === "numeric").slice(0, 12);
  const spread = new Map<string, number>();
  for (const col of numeric) {
    const values = [itemFields[col.name], ...neighbours.map((n) => n.fields[col.name])].filter((v): v is number => typeof v === "number");
    spread.set(col.name, values.length ? Math.max(...values) - Math.min(...values) : 0);
  }
  const legend = numeric.map((c) => fieldTitle(c.name, c.unit)).join(" · ");
  return (
    <div className="min-w-0">
      <ol className="divide-y divide-line overflow-hidden rounded-md border border-line bg-paper-raised">
        {neighbours.map((n, i) => {
          const cls = byId.get(n.classId);
          const diffs = numeric
            .map((col) => {
              const v = n.fields[col.name];
              return typeof v === "number" ? `${fieldTitle(col.name, col.unit)} ${formatNumber(v)}${col.unit ? ` ${col.unit}` : ""}` : null;
            })
            .filter(Boolean)
            .join(", ");
          return (
            <li key={n.itemId} className="flex items-center gap-3 px-3 py-1.5 text-sm" title={diffs}>
              <span className="num w-5 text-right text-xs text-ink-faint">{i + 1}</span>
              {n.thumbUrl ? (
                // eslint-disable-next-line @next/next/no-img-element -- presigned thumbnail
                <img src={n.thumbUrl} alt="" className="h-8 w-8 rounded object-cover" />
              ) : null}
              <span className="inline-flex min-w-24 items-center gap-1.5 font-semibold text-ink">
                <span aria-hidden="true" className="h-2.5 w-2.5 rotate-45 rounded-[2px]" style={{ background: cls?.colour ?? "#6b7282" }} />
                {cls?.name ?? "?"}
              </span>
              <span className="num w-14 text-right text-xs text-ink-soft" aria-label={`distance ${formatDistance(n.distance)}`}>
                {formatDistance(n.distance)}
              </span>
              {numeric.length ? <DiffStrip item={itemFields} neighbour={n.fields} columns={numeric} spread={spread} /> : null}
              <span className="ml-auto truncate text-xs text-ink-faint">{n.externalId}</span>
            </li>
          );
        })}
      </ol>
      {numeric.length ? (
        <p className="mt-1.5 text-[11px] leading-snug text-ink-faint">
          Bars compare each neighbour with this item, field by field (<span className="text-pine-600">up: higher</span>, <span className="text-amber-700">down: lower</span>): {legend}.
        </p>
      ) : null}
    </div>
  );
}
