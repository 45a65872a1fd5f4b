import type { DeskClass } from "@/components/desk/types";

export function ClassChip({ cls, strong = false }: { cls: DeskClass | undefined; strong?: boolean }) {
  return (
    <span className={`inline-flex items-center gap-1.5 rounded-full border px-2 py-0.5 text-xs font-semibold ${strong ? "border-ink/30 bg-paper-raised text-ink" : "border-line bg-paper text-ink"}`}>
      <span aria-hidden="true" className="h-2 w-2 rotate-45 rounded-[1px]" style={{ background: cls?.colour ?? "#6b7282" }} />
      {cls?.name ?? "unknown class"}
    </span>
  );
}

/** Every class's vote share as a row of proportional segments, with the share written under each class. */
export function VoteBars({ classes, shares }: { classes: DeskClass[]; shares: Record<string, number> }) {
  return (
    <div>
      <div className="flex h-3 overflow-hidden rounded-full bg-paper-sunk" role="img" aria-label={classes.map((c) => `${c.name} ${Math.round((shares[String(c.id)] ?? 0) * 100)}%`).join(", ")}>
        {classes.map((c) => (
          <span key={c.id} style={{ width: `${(shares[String(c.id)] ?? 0) * 100}%`, background: c.colour }} />
        ))}
      </div>
      <ul className="mt-2 grid grid-cols-2 gap-x-4 gap-y-1 text-xs sm:grid-cols-3">
        {classes.map((c) => (
          <li key={c.id} className="flex items-center gap-1.5">
            <span aria-hidden="true" className="h-2 w-2 rotate-45 rounded-[1px]" style={{ background: c.colour }} />
            <span className="text-ink-soft">{c.name}</span>
            <span className="num ml-auto font-semibold text-ink">{Math.round((shares[String(c.id)] ?? 0) * 100)}%</span>
          </li>
        ))}
      </ul>
    </div>
  );
}
