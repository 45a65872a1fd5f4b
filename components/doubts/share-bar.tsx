type ClassBrief = { id: number; name: string; colour: string };

/** Every class's vote share as one stacked strip; the item's own class is outlined. */
export function ShareBar({ shares, classes, own }: { shares: Record<string, number>; classes: ClassBrief[]; own: number }) {
  const said = classes.filter((c) => (shares[String(c.id)] ?? 0) > 0).map((c) => `${c.name} ${(100 * shares[String(c.id)]).toFixed(0)}%`);
  return (
    <>
    <p className="sr-only">Vote shares: {said.join(", ") || "none"}</p>
    <div className="flex h-2.5 w-full overflow-hidden rounded-full bg-paper-sunk" aria-hidden="true">
      {classes.map((c) => {
        const s = shares[String(c.id)] ?? 0;
        if (s <= 0) return null;
        return <div key={c.id} style={{ width: `${100 * s}%`, background: c.colour, boxShadow: c.id === own ? "inset 0 0 0 1.5px #1d2433" : undefined }} title={`${c.name} ${(100 * s).toFixed(0)}%`} />;
      })}
    </div>
    </>
  );
}

export function ClassChip({ cls }: { cls: ClassBrief | undefined }) {
  if (!cls) return <span className="text-ink-faint">—</span>;
  return (
    <span className="inline-flex items-center gap-1.5 rounded-full border border-line bg-paper-raised px-2 py-0.5 text-xs font-semibold text-ink">
      <span className="h-2 w-2 rounded-full" style={{ background: cls.colour }} aria-hidden="true" />
      {cls.name}
    </span>
  );
}

export type { ClassBrief };
