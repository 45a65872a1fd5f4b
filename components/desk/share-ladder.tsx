import { percent } from "./format";
import type { DeskClass, DeskSuggestion } from "./types";

/**
 * The label chooser and the vote shares in one: every class is a row with its key, and, when a suggestion is shown,
 * a fill as long as its share of the neighbours' vote. The suggested class carries the Enter key.
 */
export function ShareLadder({ classes, suggestion, disabled, onChoose, onTake }: { classes: DeskClass[]; suggestion: DeskSuggestion | null; disabled: boolean; onChoose: (c: DeskClass) => void; onTake: () => void }) {
  const top = suggestion?.topClassId ?? null;
  const counts = new Map<number, number>();
  for (const n of suggestion?.neighbours ?? []) counts.set(n.classId, (counts.get(n.classId) ?? 0) + 1);
  return (
    <ul className="space-y-1.5" aria-label="Label classes">
      {classes.map((c) => {
        const share = suggestion ? (suggestion.shares[String(c.id)] ?? 0) : null;
        const isTop = c.id === top;
        return (
          <li key={c.id}>
            <button
              type="button"
              disabled={disabled}
              onClick={() => (isTop ? onTake() : onChoose(c))}
              aria-keyshortcuts={isTop ? `${c.keyHint} Enter` : String(c.keyHint)}
              aria-label={`${c.name}${share != null ? `, ${percent(share)} of the vote` : ""}${isTop ? ", suggested" : ""} (key ${c.keyHint}${isTop ? " or Enter" : ""})`}
              className={`group relative flex w-full items-center gap-3 overflow-hidden rounded-md border px-3 py-2 text-left transition-colors disabled:cursor-wait ${
                isTop ? "border-pine-500 bg-paper-raised" : "border-line bg-paper-raised hover:border-line-strong"
              }`}
            >
              {share != null ? (
                <span aria-hidden="true" className="absolute inset-y-0 left-0 opacity-20 transition-[width] duration-300" style={{ width: `${share * 100}%`, background: c.colour }} />
              ) : null}
              {share != null ? <span aria-hidden="true" className="absolute bottom-0 left-0 h-[3px]" style={{ width: `${share * 100}%`, background: c.colour }} /> : null}
              <kbd className="num relative z-10 inline-flex h-6 w-6 shrink-0 items-center justify-center rounded border border-line-strong bg-paper text-xs font-bold text-ink">{c.keyHint}</kbd>
              <span aria-hidden="true" className="relative z-10 h-3 w-3 shrink-0 rotate-45 rounded-[2px]" style={{ background: c.colour }} />
              <span className="relative z-10 flex-1 truncate text-sm font-bold text-ink">{c.name}</span>
              {isTop ? (
                <span className="relative z-10 inline-flex items-center gap-1 rounded-full bg-pine-600 px-2 py-0.5 text-[11px] font-bold uppercase tracking-wide text-white">
                  Suggested <kbd className="font-sans">↵</kbd>
                </span>
              ) : null}
              {share != null ? (
                <span className="relative z-10 w-20 text-right">
                  <span className="num text-sm font-semibold text-ink">{percent(share)}</span>
                  <span className="num ml-1 text-[11px] text-ink-faint">{counts.get(c.id) ?? 0}/{suggestion?.neighbours.length ?? 0}</span>
                </span>
              ) : null}
            </button>
          </li>
        );
      })}
    </ul>
  );
}
